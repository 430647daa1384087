import { businessDaysBetween, closingProgress, lastAtRiskClosingDate } from './closing-progress';

describe('businessDaysBetween', () => {
  it('counts Monday to Friday only (2026-12-04 is a Friday)', () => {
    expect(businessDaysBetween('2026-12-04', '2026-12-07')).toBe(1); // Sat, Sun, Mon
    expect(businessDaysBetween('2026-12-01', '2026-12-08')).toBe(5);
    expect(businessDaysBetween('2026-12-08', '2026-12-08')).toBe(0);
  });

  it('counts long spans as day-by-day counting does (every start weekday, spans up to two years)', () => {
    const dayByDay = (from: string, to: string): number => {
      let count = 0;
      for (let t = Date.parse(`${from}T00:00:00Z`) + 86_400_000; t <= Date.parse(`${to}T00:00:00Z`); t += 86_400_000) {
        const day = new Date(t).getUTCDay();
        if (day !== 0 && day !== 6) count++;
      }
      return count;
    };
    for (let start = 0; start < 7; start++) {
      const from = new Date(Date.UTC(2026, 11, 1 + start)).toISOString().slice(0, 10);
      for (const span of [0, 1, 5, 6, 7, 8, 13, 14, 30, 365, 366, 730]) {
        const to = new Date(Date.UTC(2026, 11, 1 + start + span)).toISOString().slice(0, 10);
        expect(businessDaysBetween(from, to)).toBe(dayByDay(from, to));
        expect(businessDaysBetween(to, from) + dayByDay(from, to)).toBe(0);
      }
    }
  });

  it('is negative once the date has passed', () => {
    expect(businessDaysBetween('2026-12-08', '2026-12-01')).toBe(-5);
  });
});

describe('closingProgress', () => {
  const base = { today: '2026-12-01', approvedCount: 3, atRiskBusinessDays: 3 };

  it('flags open approved work within the set number of business days', () => {
    expect(closingProgress({ ...base, closingDate: '2026-12-04', resolvedCount: 1 })).toMatchObject({ businessDaysLeft: 3, isAtRisk: true });
    expect(closingProgress({ ...base, closingDate: '2026-12-07', resolvedCount: 1 })).toMatchObject({ businessDaysLeft: 4, isAtRisk: false });
  });

  it('never flags a request whose approved items all have an outcome', () => {
    expect(closingProgress({ ...base, closingDate: '2026-12-02', resolvedCount: 3 }).isAtRisk).toBe(false);
  });
});

describe('lastAtRiskClosingDate', () => {
  it('is the last closing date at risk (2026-12-01 is a Tuesday: three business days reach Friday, and the weekend after it)', () => {
    expect(lastAtRiskClosingDate('2026-12-01', 3)).toBe('2026-12-06');
    expect(lastAtRiskClosingDate('2026-12-04', 0)).toBe('2026-12-06');
    expect(lastAtRiskClosingDate('2026-12-05', 1)).toBe('2026-12-07');
  });

  it('splits closing dates exactly as closingProgress flags open work (every weekday of two weeks, every setting 0-30, closings a year either side)', () => {
    for (let start = 0; start < 14; start++) {
      const today = new Date(Date.UTC(2026, 11, 1 + start)).toISOString().slice(0, 10);
      for (let days = 0; days <= 30; days++) {
        const last = lastAtRiskClosingDate(today, days);
        for (let offset = -366; offset <= 366; offset++) {
          const closingDate = new Date(Date.UTC(2026, 11, 1 + start + offset)).toISOString().slice(0, 10);
          const { isAtRisk } = closingProgress({ closingDate, today, approvedCount: 1, resolvedCount: 0, atRiskBusinessDays: days });
          if (isAtRisk !== closingDate <= last) throw new Error(`${today}, ${days} days, closing ${closingDate}: ${isAtRisk} but last at risk ${last}`);
        }
      }
    }
    // Monday 2026-12-14: thirty business days are six weeks, to Monday 2027-01-25.
    expect(lastAtRiskClosingDate('2026-12-14', 30)).toBe('2027-01-25');
  });
});
