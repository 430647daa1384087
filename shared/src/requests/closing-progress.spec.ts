import { businessDaysBetween, closingProgress } from './closing-progress';

describe('businessDaysBetween', () => {
  it('counts Monday to Friday only (2026-12-04 is a Friday)', () => {
    expect(businessDaysBetween('2026-12-04', '2026-12-07')).toBe(1); // Sat, Sun, Mon
    expect(businessDaysBetween('2026-12-01', '2026-12-08')).toBe(5);
    expect(businessDaysBetween('2026-12-08', '2026-12-08')).toBe(0);
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
