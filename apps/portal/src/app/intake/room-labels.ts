import { Room } from '@cc/shared';

/** Rooms as people say them. */
export const ROOM_LABELS: Record<Room, string> = {
  bathroom: 'Bathroom',
  kitchen: 'Kitchen',
  garage: 'Garage',
  exterior: 'Exterior',
  basement: 'Basement',
  'crawl-space': 'Crawl space',
  laundry: 'Laundry',
  bedroom: 'Bedroom',
  'living-area': 'Living area',
  hallway: 'Hallway',
  attic: 'Attic',
  panel: 'Electrical panel',
  dining: 'Dining room',
  office: 'Office or den',
  'whole-house': 'Whole house',
  unknown: 'Not stated',
};
