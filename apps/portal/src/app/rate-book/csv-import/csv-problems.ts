import { ApiErrorDetail } from '@cc/shared';

/** A problem of an imported CSV file, placed for a person: its row (counted after the header) and column. */
export interface CsvProblem {
  row: number | null;
  column: string | null;
  message: string;
}

/** Reads the server's `rows.3.markupBp` paths into row 3, column markupBp; `header` and others have no row. */
export function csvProblems(details: readonly ApiErrorDetail[]): CsvProblem[] {
  return details.map((detail) => {
    const match = /^rows\.(\d+)(?:\.(.+))?$/.exec(detail.path);
    if (match) return { row: Number(match[1]), column: match[2] ?? null, message: detail.message };
    return { row: null, column: detail.path && detail.path !== 'rows' ? detail.path : null, message: detail.message };
  });
}
