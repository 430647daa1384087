import { csvProblems } from './csv-problems';

describe('csvProblems', () => {
  it('places row-level problems at their row and column', () => {
    expect(
      csvProblems([
        { path: 'rows.3.markupBp', message: 'Enter a whole number (cents, minutes or basis points)' },
        { path: 'rows.7', message: 'Too few fields' },
        { path: 'header', message: 'Missing column: materials' },
        { path: 'rows', message: 'The file has no entries' },
      ]),
    ).toEqual([
      { row: 3, column: 'markupBp', message: 'Enter a whole number (cents, minutes or basis points)' },
      { row: 7, column: null, message: 'Too few fields' },
      { row: null, column: 'header', message: 'Missing column: materials' },
      { row: null, column: null, message: 'The file has no entries' },
    ]);
  });
});
