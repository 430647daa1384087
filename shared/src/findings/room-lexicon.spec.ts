import { findRooms } from './room-lexicon';

const roomsOf = (text: string) => findRooms(text).map((r) => r.room);

describe('findRooms', () => {
  it.each([
    ['primary bath, left of sink', 'bathroom'],
    ['hall bath receptacle', 'bathroom'],
    ['KIT COUNTER RCPTS', 'kitchen'],
    ['MASTER BEDRM', 'bedroom'],
    ['bsmt', 'basement'],
    ['crawlspace', 'crawl-space'],
    ['LR', 'living-area'],
    ['front entry', 'hallway'],
    ['the sub panel', 'panel'],
    ['throughout the home', 'whole-house'],
    ['dining area', 'dining'],
    ['home office', 'office'],
    ['rear deck', 'exterior'],
    ['dryer circuit', 'laundry'],
  ])('reads "%s" as %s', (text, room) => {
    expect(roomsOf(text)[0]).toBe(room);
  });

  it('reads a hall bath as one bathroom, not a hallway and a bathroom', () => {
    expect(roomsOf('the hall bath')).toEqual(['bathroom']);
  });

  it('marks a place named only as a reference point', () => {
    const [box, kitchen] = findRooms('open junction box in the attic beneath the kitchen');
    expect(box.room).toBe('attic');
    expect(box.isReferencePoint).toBe(false);
    expect(kitchen.isReferencePoint).toBe(true);
  });

  it('does not mark "under the kitchen sink" as a reference point', () => {
    expect(findRooms('wiring under the kitchen sink')[0].isReferencePoint).toBe(false);
  });

  it('gives mentions in reading order with offsets', () => {
    const text = 'garage and kitchen';
    const rooms = findRooms(text);
    expect(rooms.map((r) => text.slice(r.start, r.end))).toEqual(['garage', 'kitchen']);
  });
});
