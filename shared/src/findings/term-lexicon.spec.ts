import { gap, rx, T } from './term-lexicon';

const whole = (src: string) => new RegExp(`^(?:${src})$`, 'i');

describe('term lexicon', () => {
  // Common practice: inspectors' spellings and abbreviations seen in reports.
  it.each(['receptacle', 'receptacles', 'recepticle', 'receptical', 'recepticals', 'receptecle', 'recep.', 'rcpt', 'rcpts', 'outlet', 'outlett'])(
    'reads %s as a receptacle',
    (word) => expect(whole(T.RCPT).test(word)).toBe(true),
  );

  it.each(['GFCI', 'gfi', 'GFCIs', 'ground fault', 'ground-fault protected', 'ground fault circuit interrupter'])('reads %s as GFCI', (word) => {
    expect(whole(T.GFCI).test(word)).toBe(true);
  });

  it.each(['AFCI', 'arc-fault', 'arc fault circuit interrupter'])('reads %s as AFCI', (word) => {
    expect(whole(T.AFCI).test(word)).toBe(true);
  });

  it('reads j-box, J box and junction box as a junction box', () => {
    for (const word of ['j-box', 'J box', 'junction boxes', 'jbox']) expect(whole(T.JBOX).test(word)).toBe(true);
  });

  it('does not let a gap cross a device noun', () => {
    const re = rx`loose\s+${gap(3)}receptacle`;
    expect('loose kitchen receptacle').toMatch(re);
    expect('loose wiring near receptacle').not.toMatch(re);
  });

  it('builds case-insensitive global patterns', () => {
    const re = rx`double tap`;
    expect(re.flags).toContain('g');
    expect('DOUBLE TAP'.match(re)).toHaveLength(1);
  });
});
