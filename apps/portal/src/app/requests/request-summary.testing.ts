// For component specs: a request as a list page carries it, with the fields a spec cares about changed.
import type { RepairRequestSummary } from '@cc/shared';

export function summary(id: number, overrides: Partial<RepairRequestSummary> = {}): RepairRequestSummary {
  return {
    id,
    reference: `CC-${String(id).padStart(4, '0')}`,
    street: `${id} Aspen Court`,
    city: 'Fort Collins',
    state: 'CO',
    zip: '80521',
    yearBuilt: 1978,
    closingDate: '2026-04-22',
    necEdition: 2023,
    status: 'pricing',
    contractorName: 'Foothill Wiring Co.',
    itemCount: 4,
    openWorkCount: 0,
    isAtRisk: false,
    createdAt: '2026-03-01T15:00:00Z',
    updatedAt: '2026-03-02T15:00:00Z',
    ...overrides,
  };
}
