import { locationText, placeLabel } from './room';

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

  it('reads a location written in capitals, as headings are, in sentence case', () => {
    expect(placeLabel('garage', 'GARAGE')).toBe('Garage');
    expect(placeLabel('unknown', 'REAR PATIO')).toBe('Rear patio');
    expect(placeLabel('kitchen', 'UNIT 2B KITCHEN')).toBe('Unit 2B kitchen');
  });
});

describe('locationText', () => {
  it('keeps text with lower-case letters as written', () => {
    expect(locationText('Primary bath, GFCI by the tub')).toBe('Primary bath, GFCI by the tub');
    expect(locationText('  left of sink ')).toBe('left of sink');
  });

  it('brings capitals to sentence case but keeps words with digits and initialisms', () => {
    expect(locationText('BASEMENT - NE CORNER')).toBe('Basement - NE corner');
    expect(locationText('HVAC CLOSET')).toBe('HVAC closet');
    expect(locationText('A/C CONDENSER')).toBe('A/C condenser');
    expect(locationText('BEDROOM 3')).toBe('Bedroom 3');
  });

  it('gives an empty text for no location', () => {
    expect(locationText(null)).toBe('');
    expect(locationText(undefined)).toBe('');
    expect(locationText('B')).toBe('B');
  });
});
