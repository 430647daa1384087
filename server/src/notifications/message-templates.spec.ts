import { electricianVisitChanges } from '../work/proof-messages';
import { layOut, MAX_SUBJECT, visitWindowText, wordsFor } from './message-templates';

const request = { id: 8, reference: 'CC-00008', address: '87 Tinsmith Way, Marlow Springs, CO 81290', closingDate: '2027-02-20' };

describe('visitWindowText', () => {
  // 12-hour clock as US readers write it: 00:xx is 12:xx AM, 12:xx is 12:xx PM.
  it.each([
    [{ date: '2027-02-10', arrivalFrom: '08:00', arrivalTo: '10:30' }, 'Wednesday, February 10, 2027, arriving between 8:00 AM and 10:30 AM'],
    [{ date: '2027-02-28', arrivalFrom: '12:00', arrivalTo: '13:05' }, 'Sunday, February 28, 2027, arriving between 12:00 PM and 1:05 PM'],
    [{ date: '2028-02-29', arrivalFrom: '00:30', arrivalTo: '23:59' }, 'Tuesday, February 29, 2028, arriving between 12:30 AM and 11:59 PM'],
  ])('%j → %s', (window, text) => {
    expect(visitWindowText(window)).toBe(text);
  });
});

describe('wordsFor a visit', () => {
  const base = { kind: 'visit-scheduled', requestId: 8, actorUserId: null, visitNumber: 2, date: '2027-02-10', arrivalFrom: '13:00', arrivalTo: '15:30' } as const;

  it('says when a booked visit is and links to the visits and proof page', () => {
    const words = wordsFor({ ...base, previous: null }, request);
    expect(words.subject).toBe("CC-00008: electrician's visit on Wednesday, February 10, 2027");
    expect(words.paragraphs[0]).toBe('The contractor booked visit 2 to 87 Tinsmith Way, Marlow Springs, CO 81290 on Wednesday, February 10, 2027, arriving between 1:00 PM and 3:30 PM.');
    expect(words.action?.path).toBe('/requests/8/work');
  });

  it('says that a moved visit moved, and from when', () => {
    const words = wordsFor({ ...base, previous: { date: '2027-02-09', arrivalFrom: '08:00', arrivalTo: '10:00' } }, request);
    expect(words.subject).toBe("CC-00008: electrician's visit moved to Wednesday, February 10, 2027");
    expect(words.paragraphs[0]).toContain('It was on Tuesday, February 9, 2027, arriving between 8:00 AM and 10:00 AM.');
  });
});

describe('the electrician’s own visit messages', () => {
  const slot = (electricianId: number, date = '2027-02-10', arrivalFrom = '08:00', arrivalTo = '10:00') => ({ electricianId, date, arrivalFrom, arrivalTo });

  it.each([
    ['a new visit is booked for its electrician', null, slot(5), [[5, 'booked']]],
    ['another day for the same electrician is a move', slot(5), slot(5, '2027-02-11'), [[5, 'moved']]],
    ['another window for the same electrician is a move', slot(5), slot(5, '2027-02-10', '13:00', '15:00'), [[5, 'moved']]],
    ['handed to a colleague: taken off one day, booked on the other', slot(5), slot(6, '2027-02-11'), [[5, 'removed'], [6, 'booked']]],
    ['nothing the electrician sees changed', slot(5), slot(5), []],
  ] as const)('%s', (_name, before, after, expected) => {
    expect(electricianVisitChanges(before, after).map((c) => [c.electricianId, c.change])).toEqual(expected);
  });

  const base = { kind: 'electrician-visit', requestId: 8, actorUserId: 3, electricianUserId: 5, visitId: 40, visitNumber: 2, date: '2027-02-10', arrivalFrom: '13:00', arrivalTo: '15:30', previous: null, handedTo: null, changeRef: '1' } as const;

  it('booked: says the day and window and opens the electrician’s day plan on that day', () => {
    const words = wordsFor({ ...base, change: 'booked' }, request);
    expect(words.subject).toBe('CC-00008: your visit 2 on Wednesday, February 10, 2027');
    expect(words.paragraphs[0]).toBe('Visit 2 to 87 Tinsmith Way, Marlow Springs, CO 81290 is booked for you on Wednesday, February 10, 2027, arriving between 1:00 PM and 3:30 PM.');
    expect(words.action).toEqual({ label: 'Open your day plan', path: '/day-plan?date=2027-02-10&electricianId=5' });
  });

  it('moved: the new window and the old one', () => {
    const words = wordsFor({ ...base, change: 'moved', previous: { date: '2027-02-09', arrivalFrom: '08:00', arrivalTo: '10:00' } }, request);
    expect(words.subject).toBe('CC-00008: your visit 2 moved to Wednesday, February 10, 2027');
    expect(words.paragraphs[0]).toContain('It was on Tuesday, February 9, 2027, arriving between 8:00 AM and 10:00 AM.');
  });

  it('removed: taken off the day, naming the colleague who has it now', () => {
    const words = wordsFor({ ...base, change: 'removed', handedTo: 'Lee Park' }, request);
    expect(words.subject).toBe('CC-00008: visit 2 on Wednesday, February 10, 2027 taken off your day');
    expect(words.paragraphs[0]).toBe('Visit 2 to 87 Tinsmith Way, Marlow Springs, CO 81290 on Wednesday, February 10, 2027, arriving between 1:00 PM and 3:30 PM, is no longer booked for you: it went to Lee Park.');
  });
});

describe('wordsFor a cancelled visit', () => {
  const window = { requestId: 8, actorUserId: 3, visitNumber: 2, date: '2027-02-10', arrivalFrom: '13:00', arrivalTo: '15:30' } as const;

  it('tells the seller’s side which visit is off, when it was, and why, and links to the visits page', () => {
    const words = wordsFor({ kind: 'visit-cancelled', ...window, reason: 'The occupant is ill' }, request);
    expect(words.subject).toBe("CC-00008: electrician's visit on Wednesday, February 10, 2027 cancelled");
    expect(words.paragraphs[0]).toBe(
      'The contractor cancelled visit 2 to 87 Tinsmith Way, Marlow Springs, CO 81290, which was booked for Wednesday, February 10, 2027, arriving between 1:00 PM and 3:30 PM, with this reason: “The occupant is ill”',
    );
    expect(words.action?.path).toBe('/requests/8/work');
  });

  it('tells the electrician it is off their day, with the reason, and opens that day', () => {
    const words = wordsFor({ kind: 'electrician-visit', ...window, electricianUserId: 5, visitId: 40, change: 'cancelled', previous: null, handedTo: null, reason: 'Part back-ordered', changeRef: '1' }, request);
    expect(words.subject).toBe('CC-00008: visit 2 on Wednesday, February 10, 2027 cancelled');
    expect(words.paragraphs[0]).toBe('Visit 2 to 87 Tinsmith Way, Marlow Springs, CO 81290 on Wednesday, February 10, 2027, arriving between 1:00 PM and 3:30 PM, is cancelled: “Part back-ordered”.');
    expect(words.action).toEqual({ label: 'Open your day plan', path: '/day-plan?date=2027-02-10&electricianId=5' });
  });
});

describe('wordsFor a change order decided', () => {
  it('names who decided, in what capacity, in the subject (the history’s words) and the message', () => {
    const words = wordsFor({ kind: 'change-order-decided', requestId: 8, actorUserId: 4, changeOrderId: 3, number: 1, priceCents: 3_435, isApproved: true, signedBy: 'Robert Hale, listing agent, for the seller' }, request);
    expect(words.subject).toBe('CC-00008: change order 1 approved by Robert Hale, listing agent, for the seller');
    expect(words.paragraphs[0]).toBe('Robert Hale, listing agent, for the seller, approved and signed change order 1 for 87 Tinsmith Way, Marlow Springs, CO 81290 (+$34.35). It is part of the approved work now.');
  });
});

describe('layOut', () => {
  it('cuts a subject longer than the outbox keeps (a 200-character street and an escrow file number) instead of failing the change', () => {
    const long = `Invoice INV-000003 payable at closing — ${'Long Street '.repeat(20)}, Marlow Springs, CO 81290 (file ${'F'.repeat(80)})`;
    const message = layOut({ subject: long, paragraphs: ['Hello'], action: null }, { publicUrl: 'http://portal.test', recipientName: null, footer: null, footerLink: null });
    expect(long.length).toBeGreaterThan(MAX_SUBJECT);
    expect(message.subject).toHaveLength(MAX_SUBJECT);
    expect(message.subject.endsWith('…')).toBe(true);
    expect(message.text).not.toContain('http://portal.test/');
  });
});

