import { placeLabel } from './room';

describe('placeLabel', () => {
  it('names the room and the location once each', () => {
    expect(placeLabel('kitchen', 'countertop left of sink')).toBe('Kitchen, countertop left of sink');
  });

  it('does not repeat the room when the location already says it', () => {
    expect(placeLabel('kitchen', 'Kitchen')).toBe('Kitchen');
    expect(placeLabel('bedroom', 'bedroom')).toBe('Bedroom');
    expect(placeLabel('bedroom', 'primary bedroom near the window')).toBe('Primary bedroom near the window');
    expect(placeLabel('crawl-space', 'crawl space, north wall')).toBe('Crawl space, north wall');
    expect(placeLabel('panel', 'main electrical panel')).toBe('Main electrical panel');
  });

  it('uses the room alone without a location, and the location alone when the room is not stated', () => {
    expect(placeLabel('garage', null)).toBe('Garage');
    expect(placeLabel('garage', '  ')).toBe('Garage');
    expect(placeLabel('unknown', 'rear patio')).toBe('Rear patio');
    expect(placeLabel('unknown', null)).toBe('Not stated');
  });
});
