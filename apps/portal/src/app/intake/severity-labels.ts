import { Severity } from '@cc/shared';

/** How urgent a finding is, in plain words. */
export const SEVERITY_LABELS: Record<Severity, string> = {
  safety: 'Safety',
  repair: 'Repair',
  upgrade: 'Upgrade',
  evaluate: 'Needs evaluation',
};
