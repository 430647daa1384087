import { clockOf, dayPlanWarnings, minutesOfDay, scheduleDay, type StopToSchedule } from './day-schedule';

const day = { dayStart: '07:30', dayEnd: '16:30', lunchStart: '12:00', lunchMinutes: 30 };
const stop = (driveMinutes: number, onSiteMinutes: number, arrivalFrom = '07:00', arrivalTo = '18:00'): StopToSchedule => ({ driveMinutes, onSiteMinutes, arrivalFrom, arrivalTo });

describe('clock helpers', () => {
  it('turns HH:MM into minutes and back', () => {
    expect(minutesOfDay('07:30')).toBe(450);
    expect(clockOf(450)).toBe('07:30');
    expect(clockOf(1439)).toBe('23:59');
  });
});

describe('scheduleDay', () => {
  it('drives, works and drives back from the start of the day', () => {
    const plan = scheduleDay(day, [stop(12, 60), stop(8, 45)], 15);
    expect(plan.stops.map((s) => [s.arrival, s.start, s.finish])).toEqual([
      ['07:42', '07:42', '08:42'],
      ['08:50', '08:50', '09:35'],
    ]);
    expect(plan.finish).toBe('09:50');
    expect(plan.lunch).toBeNull();
    expect(plan.overflowMinutes).toBe(0);
  });

  it('leaves the shop in time for the first window instead of waiting at the door', () => {
    const plan = scheduleDay(day, [stop(10, 60, '09:00', '11:00'), stop(10, 240, '08:00', '10:00'), stop(10, 30, '08:00', '10:00')], 10);
    expect(plan.leaveAt).toBe('08:50');
    expect(plan.stops[0]).toMatchObject({ arrival: '09:00', waitMinutes: 0, start: '09:00', finish: '10:00', isLate: false });
    expect(plan.stops[1]).toMatchObject({ arrival: '10:10', isLate: true });
  });

  it('never leaves before the start of the day, and waits at a later stop whose window opens after the arrival', () => {
    const plan = scheduleDay(day, [stop(30, 30, '07:30', '09:30'), stop(10, 30, '10:00', '12:00')], 10);
    expect(plan.leaveAt).toBe('07:30');
    expect(plan.stops[0]).toMatchObject({ arrival: '08:00', waitMinutes: 0 });
    expect(plan.stops[1]).toMatchObject({ arrival: '08:40', waitMinutes: 80, start: '10:00' });
  });

  it('takes lunch at the first departure at or after lunch time', () => {
    const plan = scheduleDay(day, [stop(10, 240), stop(10, 60), stop(10, 60)], 10);
    // 07:30 + 10 → 07:40–11:40; 11:50–12:50; lunch at 12:50 before driving on.
    expect(plan.stops.map((s) => s.lunchBefore)).toEqual([false, false, true]);
    expect(plan.lunch).toEqual({ from: '12:50', to: '13:20' });
    expect(plan.stops[2].arrival).toBe('13:30');
  });

  it('counts the minutes past the end of the working day as overflow', () => {
    const plan = scheduleDay(day, [stop(20, 240), stop(20, 240)], 20);
    // 07:30 + 20 + 240 = 11:50; + 20 + 240 = 16:10; lunch 16:10–16:40; + 20 back = 17:00 → 30 minutes over 16:30.
    expect(plan.finish).toBe('17:00');
    expect(plan.overflowMinutes).toBe(30);
  });

  it('plans an empty day as no work and no lunch', () => {
    expect(scheduleDay(day, [], 25)).toEqual({ leaveAt: '07:30', stops: [], lunch: null, finish: '07:30', overflowMinutes: 0 });
  });
});

describe('dayPlanWarnings', () => {
  const base = { address: '1 Elm', driveMinutes: 10, isLate: false, arrival: '08:00', arrivalFrom: '08:00', arrivalTo: '10:00', hasPlace: true };

  it('says nothing about a usual day (common practice: 3–5 short visits within 20–30 minutes’ drive)', () => {
    expect(dayPlanWarnings({ dayEnd: '16:30', overflowMinutes: 0, isShopLocated: true, stops: [base, base, base, base] })).toEqual([]);
  });

  it('puts the overflow first, then late arrivals, unknown places, too many visits and long drives', () => {
    const stops = [{ ...base, isLate: true, arrival: '10:20' }, { ...base, address: '2 Oak', hasPlace: false, driveMinutes: null }, { ...base, address: '3 Ash', driveMinutes: 41 }, base, base, base];
    const warnings = dayPlanWarnings({ dayEnd: '16:30', overflowMinutes: 45, isShopLocated: true, stops });
    expect(warnings[0]).toBe('The day runs 45 minutes past 16:30: move a visit to another day or electrician.');
    expect(warnings[1]).toContain('1 Elm: the planned arrival 10:20 is after the window 08:00–10:00');
    expect(warnings[2]).toContain('2 Oak: its ZIP code is not in the ZIP-code list');
    expect(warnings[3]).toContain('6 visits: more than the usual 3–5');
    expect(warnings[4]).toContain("3 Ash: 41 minutes' drive");
  });
});
