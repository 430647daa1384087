import { scoreCorpus, scoreFile } from '../corpus/score';

// Worked example, counted by hand: expected {A@x, A@x, B@y}; predicted {A@x, B@z, C@y}.
// Multiset match on (code, room): one A@x matches (tp 1), A@x and B@y are missed (fn 2),
// B@z and C@y are extra (fp 2). Precision 1/3, recall 1/3, F1 1/3.
describe('scoreFile', () => {
  const expected = [
    { code: 'A', room: 'x', quantity: 2 },
    { code: 'A', room: 'x', quantity: null },
    { code: 'B', room: 'y', quantity: null },
  ];
  const predicted = [
    { code: 'A', room: 'x', quantity: null },
    { code: 'B', room: 'z', quantity: null },
    { code: 'C', room: 'y', quantity: 1 },
  ];

  it('matches (code, room) pairs as a multiset', () => {
    const s = scoreFile('f', expected, predicted);
    expect([s.truePositives, s.falsePositives, s.falseNegatives]).toEqual([1, 2, 2]);
    expect(s.missed.sort()).toEqual(['A@x', 'B@y']);
    expect(s.extra.sort()).toEqual(['B@z', 'C@y']);
  });

  it('pairs equal quantities first when measuring quantity accuracy', () => {
    expect(scoreFile('f', expected, predicted).quantityCorrect).toBe(1);
  });
});

describe('scoreCorpus', () => {
  it('sums files and computes precision, recall and F1', () => {
    const s = scoreCorpus([
      scoreFile('a', [{ code: 'A', room: 'x', quantity: 1 }], [{ code: 'A', room: 'x', quantity: 2 }]),
      scoreFile('b', [{ code: 'B', room: 'y', quantity: null }], []),
    ]);
    // tp 1, fp 0, fn 1: precision 1, recall 0.5, F1 = 2 * 1 * 0.5 / 1.5 = 2/3; quantity 0/1.
    expect(s.precision).toBe(1);
    expect(s.recall).toBe(0.5);
    expect(s.f1).toBeCloseTo(2 / 3, 10);
    expect(s.quantityAccuracy).toBe(0);
  });

  it('scores an empty corpus as perfect rather than dividing by zero', () => {
    expect(scoreCorpus([]).precision).toBe(1);
  });
});
