import { SkipReason } from '@cc/shared';

/** Why a passage of the report produced no item, in plain words. */
export const SKIP_REASON_LABELS: Record<SkipReason, string> = {
  'non-electrical-section': 'Not electrical',
  'no-electrical-finding': 'No electrical defect found',
  negated: 'Says the defect is absent',
  'not-itemised': 'Read but not itemised',
};
