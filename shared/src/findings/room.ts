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

/** Rooms as people say them (portal, quote PDF). */
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

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** Words kept in capitals when a location written in capitals is brought to sentence case. */
const KEPT_CAPITALS = new Set(['GFCI', 'GFI', 'AFCI', 'HVAC', 'A/C', 'AC', 'NEC', 'N', 'S', 'E', 'W', 'NE', 'NW', 'SE', 'SW']);

/**
 * A location as the report gave it, for reading: a heading's capitals ("GARAGE", "UNIT 2B - KITCHEN")
 * become sentence case ("Garage", "Unit 2B - kitchen"); words with digits and the trade's initialisms
 * keep their capitals; text with any lower-case letter is kept as written.
 */
export function locationText(location: string | null | undefined): string {
  const place = (location ?? '').trim();
  if (/[a-z]/.test(place) || !/[A-Z]{2}/.test(place)) return place;
  const words = place.split(/(\s+)/).map((word) => (/\d/.test(word) || KEPT_CAPITALS.has(word.replace(/[^A-Z/]/g, '')) ? word : word.toLowerCase()));
  return capitalised(words.join(''));
}

/**
 * Where an item is, in words: the room and the reader's or agent's location, without saying the room
 * twice ("Kitchen, countertop left of sink"; a location "kitchen" or "primary bedroom" stands alone).
 */
export function placeLabel(room: Room | string, location: string | null | undefined): string {
  const known = (ROOMS as readonly string[]).includes(room);
  const roomText = known ? ROOM_LABELS[room as Room] : room ? capitalised(room.replace(/-/g, ' ')) : ROOM_LABELS.unknown;
  const place = locationText(location);
  if (!place) return roomText;
  if (room === 'unknown' || !room) return capitalised(place);
  const said = place.toLowerCase();
  const names = [roomText.toLowerCase(), room.replace(/-/g, ' ')];
  if (names.some((name) => said.includes(name))) return capitalised(place);
  return `${roomText}, ${place}`;
}
