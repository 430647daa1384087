/**
 * Progress of a request's approved work against its closing date. Pure: the caller supplies today
 * and the number of business days before closing at which open work counts as at risk (a setting).
 */
export interface ClosingProgress {
  /** Weekdays (Monday to Friday) from today, exclusive, up to and including the closing date; negative once past. */
  businessDaysLeft: number;
  /** Approved items in total, and those with an outcome (corrected, not corrected, accepted…). */
  approvedCount: number;
  resolvedCount: number;
  /** Whether approved items are still open this close to closing. */
  isAtRisk: boolean;
}

const MS_PER_DAY = 86_400_000;

function isWeekday(ms: number): boolean {
  const day = new Date(ms).getUTCDay();
  return day !== 0 && day !== 6;
}

/** Weekdays after `from` up to and including `to` (ISO dates); negative when `to` is before `from`. */
export function businessDaysBetween(from: string, to: string): number {
  const start = Date.parse(`${from}T00:00:00Z`);
  const end = Date.parse(`${to}T00:00:00Z`);
  const sign = end >= start ? 1 : -1;
  const [low, high] = sign > 0 ? [start, end] : [end, start];
  // Any seven days in a row hold five weekdays: whole weeks are counted at once, only the rest
  // (up to six days) day by day, so a far closing date costs no more than a near one (lists compute
  // this for every row).
  const days = Math.round((high - low) / MS_PER_DAY);
  const weeks = Math.floor(days / 7);
  let count = weeks * 5;
  for (let t = low + (weeks * 7 + 1) * MS_PER_DAY; t <= high; t += MS_PER_DAY) if (isWeekday(t)) count++;
  return sign * count;
}

export function closingProgress(input: { closingDate: string; today: string; approvedCount: number; resolvedCount: number; atRiskBusinessDays: number }): ClosingProgress {
  const businessDaysLeft = businessDaysBetween(input.today, input.closingDate);
  const hasOpenWork = input.resolvedCount < input.approvedCount;
  return {
    businessDaysLeft,
    approvedCount: input.approvedCount,
    resolvedCount: input.resolvedCount,
    isAtRisk: hasOpenWork && businessDaysLeft <= input.atRiskBusinessDays,
  };
}

/**
 * The latest closing date at which open approved work is at risk today: for open work,
 * `closingProgress(...).isAtRisk` holds exactly when the closing date is on or before this date
 * (business days to closing never fall as the closing date moves later). Lists compare each row's
 * closing date with it instead of counting business days per row.
 */
export function lastAtRiskClosingDate(today: string, atRiskBusinessDays: number): string {
  const isAtRisk = (ms: number) => businessDaysBetween(today, new Date(ms).toISOString().slice(0, 10)) <= atRiskBusinessDays;
  let day = Date.parse(`${today}T00:00:00Z`);
  if (isAtRisk(day)) {
    while (isAtRisk(day + MS_PER_DAY)) day += MS_PER_DAY;
  } else {
    while (!isAtRisk(day)) day -= MS_PER_DAY;
  }
  return new Date(day).toISOString().slice(0, 10);
}
