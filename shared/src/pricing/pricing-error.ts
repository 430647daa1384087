/** Why a priced input was refused; the server answers these as a 422 with `path` in the details. */
export type PricingErrorReason =
  | 'unknown-entry'
  | 'unknown-adder'
  | 'adder-not-for-flat'
  | 'duplicate-visit'
  | 'unknown-visit'
  | 'empty-visit';

export class PricingError extends Error {
  constructor(
    readonly reason: PricingErrorReason,
    /** Where in the input the problem is, e.g. `['visits', 0, 'lines', 2, 'entryId']`. */
    readonly path: readonly (string | number)[],
    message: string,
  ) {
    super(message);
    this.name = 'PricingError';
  }
}
