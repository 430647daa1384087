/** Normalised places a finding can be in. `panel` is the service or distribution panel itself. */
export const ROOMS = [
  'bathroom',
  'kitchen',
  'garage',
  'exterior',
  'basement',
  'crawl-space',
  'laundry',
  'bedroom',
  'living-area',
  'hallway',
  'attic',
  'panel',
  'dining',
  'office',
  'whole-house',
  'unknown',
] as const;

export type Room = (typeof ROOMS)[number];
