import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import { DayPlan, DayPlanStop } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { Clock } from '../../core/time/clock';
import { DayPage } from './day-page';

const stop = (visitId: number, address: string, start: string, finish: string, overrides: Partial<DayPlanStop> = {}): DayPlanStop => ({
  visitId,
  requestId: visitId + 100,
  visitNumber: 1,
  address,
  status: 'booked',
  visitVersion: 1,
  arrivalFrom: '08:00',
  arrivalTo: '10:00',
  place: { latitude: 38.83, longitude: -104.81, source: 'zip' },
  itemCount: 2,
  driveMiles: 4.2,
  driveMinutes: 9,
  arrival: start,
  start,
  finish,
  waitMinutes: 0,
  onSiteMinutes: 75,
  isLate: false,
  lunchBefore: false,
  ...overrides,
});

function plan(overrides: Partial<DayPlan> = {}): DayPlan {
  return {
    date: '2026-12-07',
    electrician: { id: 7, name: 'Lee Park' },
    dayStart: '07:30',
    leaveAt: '07:30',
    dayEnd: '16:30',
    stops: [stop(1, '16 Chapel Row, Marlow Springs', '07:39', '08:54'), stop(2, '92 Millrace Court, Marlow Springs', '09:03', '10:18', { isLate: true, arrival: '10:12' })],
    returnDriveMiles: 3.1,
    returnDriveMinutes: 7,
    finish: '10:25',
    lunch: null,
    totalDriveMinutes: 25,
    totalOnSiteMinutes: 150,
    overflowMinutes: 0,
    warnings: ['92 Millrace Court, Marlow Springs: the planned arrival 10:12 is after the window 08:00–10:00 the seller was given.'],
    suggestions: [{ requestId: 55, address: '58 Weaver Lane, Marlow Springs', closingDate: '2026-12-14', itemCount: 1, onSiteMinutes: 45, detourMinutes: 6, arrivalFrom: '10:30', arrivalTo: '12:30' }],
    ...overrides,
  };
}

describe('DayPage', () => {
  let http: HttpTestingController;

  /** Renders the page signed in as `signedInId` (the office's user, 1, by default) with the organisation's `people`; expects the day of `expectedId`. */
  async function render(answer: DayPlan, { signedInId = 1, people = [{ id: 7, name: 'Lee Park' }], expectedId = 7 } = {}) {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Clock, useValue: { today: () => '2026-12-07' } },
        { provide: Auth, useValue: { user: signal({ id: signedInId }) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(DayPage);
    await fixture.whenStable();
    http.expectOne('/api/day-plan/electricians').flush(people);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/day-plan' && r.params.get('date') === '2026-12-07' && r.params.get('electricianId') === String(expectedId)).flush(answer);
    await fixture.whenStable();
    return { fixture, host: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => http.verify());

  it('opens on the signed-in person’s own day when they are one of the electricians', async () => {
    const people = [{ id: 7, name: 'Lee Park' }, { id: 9, name: 'Sam Okafor' }];
    const { host } = await render(plan({ electrician: people[1] }), { signedInId: 9, people, expectedId: 9 });
    expect(host.textContent).toContain('Sam Okafor');
  });

  it('lists the stops in the planned order with their times, the drive before each, and the late arrival', async () => {
    const { host } = await render(plan());
    const titles = [...host.querySelectorAll('[data-testid="day-plan-stops"] mat-card-title')].map((t) => t.textContent?.trim());
    expect(titles).toEqual(['07:39–08:54 16 Chapel Row, Marlow Springs', '09:03–10:18 92 Millrace Court, Marlow Springs']);
    expect(host.textContent).toContain('9 min drive (4.2 mi) from the shop');
    expect(host.querySelector('[data-testid="day-plan-stop-1"]')?.textContent).toContain('after the window');
    expect(host.querySelector('[data-testid="day-plan-warnings"]')?.textContent).toContain('10:12 is after the window');
    expect(host.querySelector('[data-testid="day-plan-overflow"]')).toBeNull();
    expect(host.querySelectorAll('[aria-label="Safety notice"]').length).toBe(1);
  });

  it('warns in its own box when the day overflows, and suggests nothing more', async () => {
    const { host } = await render(plan({ overflowMinutes: 40, finish: '17:10', suggestions: [], warnings: ['The day runs 40 minutes past 16:30: move a visit to another day or electrician.'] }));
    expect(host.querySelector('[data-testid="day-plan-overflow"]')?.textContent).toContain('The day runs 40 minutes past 16:30');
    expect(host.querySelector('[data-testid="day-plan-warnings"]')).toBeNull();
    expect(host.textContent).toContain('The day is full: no more jobs are suggested.');
  });

  it('books a suggested job with one click and shows the day planned again', async () => {
    const { fixture, host } = await render(plan());
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Book 10:30–12:30' }))).click();
    const req = http.expectOne('/api/day-plan/book');
    expect(req.request.body).toEqual({ requestId: 55, date: '2026-12-07', electricianId: 7 });
    req.flush(plan({ suggestions: [], stops: [...plan().stops, stop(3, '58 Weaver Lane, Marlow Springs', '10:30', '11:15')] }));
    await fixture.whenStable();
    expect(host.querySelectorAll('[data-testid="day-plan-stops"] > li').length).toBe(3);
  });

  it('keeps a date chosen before the list of electricians has arrived and opens that day', async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Clock, useValue: { today: () => '2026-12-07' } }, { provide: Auth, useValue: { user: signal({ id: 1 }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(DayPage);
    await fixture.whenStable();
    const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('[data-testid="day-plan-date"]')!;
    input.value = '2026-12-09';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    http.expectOne('/api/day-plan/electricians').flush([{ id: 7, name: 'Lee Park' }]);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/day-plan' && r.params.get('date') === '2026-12-09' && r.params.get('electricianId') === '7').flush(plan({ date: '2026-12-09' }));
    await fixture.whenStable();
    expect(input.value).toBe('2026-12-09');
  });

  it('shows the latest choice only: the answer for an earlier date is cancelled, never drawn over it', async () => {
    const { fixture, host } = await render(plan());
    const input = host.querySelector<HTMLInputElement>('[data-testid="day-plan-date"]')!;
    input.value = '2026-12-08';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    const first = http.expectOne((r) => r.url === '/api/day-plan' && r.params.get('date') === '2026-12-08');
    input.value = '2026-12-09';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    const second = http.expectOne((r) => r.url === '/api/day-plan' && r.params.get('date') === '2026-12-09');
    expect(first.cancelled).toBe(true);
    second.flush(plan({ date: '2026-12-09', stops: [stop(4, '7 Tannery Close, Marlow Springs', '08:10', '09:00')] }));
    await fixture.whenStable();
    const titles = [...host.querySelectorAll('[data-testid="day-plan-stops"] mat-card-title')].map((t) => t.textContent?.trim());
    expect(titles).toEqual(['08:10–09:00 7 Tannery Close, Marlow Springs']);
  });
});
