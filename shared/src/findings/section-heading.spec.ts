import { classifyHeadingLine, inlineNonElectricalLabel } from './section-heading';

const kindOf = (line: string) => {
  const h = classifyHeadingLine(line);
  return h?.type === 'heading' ? h.heading.kind : (h?.type ?? null);
};

describe('classifyHeadingLine', () => {
  it.each([
    ['5.0 ELECTRICAL', 'electrical'],
    ['Section 7 - Electrical', 'electrical'],
    ['Electrical Service & Distribution', 'electrical'],
    ['SMOKE AND CARBON MONOXIDE ALARMS', 'electrical'],
    ['4.0 ROOFING', 'non-electrical'],
    ['HEATING AND AIR CONDITIONING', 'non-electrical'],
    ['PLUMBING SYSTEM', 'non-electrical'],
    ['HALL BATHROOM', 'room'],
    ['Attic and Insulation', 'room'],
    ['INTERIOR ROOMS', 'general'],
    ['Observations:', 'label'],
  ])('reads "%s" as %s', (line, kind) => {
    expect(kindOf(line)).toBe(kind);
  });

  it.each(['The panel is located in the garage.', 'Smoke alarms: Missing in hallway', 'Basement bar area', 'Your home\'s electrical system'])(
    'does not read "%s" as a heading',
    (line) => expect(classifyHeadingLine(line)).toBeNull(),
  );

  it('keeps the room a heading names', () => {
    const h = classifyHeadingLine('Sub-Panel (Garage)');
    expect(h?.type === 'heading' && h.heading.room).toBe('panel');
    const e = classifyHeadingLine('EXTERIOR ELECTRICAL');
    expect(e?.type === 'heading' && e.heading.room).toBe('exterior');
  });
});

describe('inlineNonElectricalLabel', () => {
  it('finds a non-electrical label at the start of a line', () => {
    expect(inlineNonElectricalLabel('Siding: vinyl, generally serviceable.')).toBe('Siding');
    expect(inlineNonElectricalLabel('Walls and ceilings: typical cosmetic cracks.')).toBe('Walls and ceilings');
  });

  it('leaves electrical and room labels alone', () => {
    expect(inlineNonElectricalLabel('Smoke alarms: Missing in hallway')).toBeNull();
    expect(inlineNonElectricalLabel('Primary bedroom: the ceiling fan is loose.')).toBeNull();
  });
});
