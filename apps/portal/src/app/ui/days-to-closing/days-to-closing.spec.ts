import { TestBed } from '@angular/core/testing';
import { Clock } from '../../core/time/clock';
import { closingCountdown } from './closing-countdown';
import { DaysToClosing } from './days-to-closing';

describe('closingCountdown', () => {
  it.each([
    [12, 'in 12 days'],
    [1, 'tomorrow'],
    [0, 'closing today'],
    [-1, 'passed yesterday'],
    [-3, 'passed 3 days ago'],
  ])('words %i days as "%s"', (days, text) => {
    expect(closingCountdown(days)).toBe(text);
  });
});

describe('DaysToClosing', () => {
  async function render(closingDate: string): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [{ provide: Clock, useValue: { today: () => '2026-03-10' } }] });
    const fixture = TestBed.createComponent(DaysToClosing);
    fixture.componentRef.setInput('closingDate', closingDate);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  it('counts calendar days from the clock, across a month end', async () => {
    const host = await render('2026-04-02');
    expect(host.textContent?.trim()).toBe('in 23 days');
    expect(host.dataset['urgency']).toBe('later');
  });

  it('marks a date within a week as this week', async () => {
    const host = await render('2026-03-15');
    expect(host.textContent?.trim()).toBe('in 5 days');
    expect(host.dataset['urgency']).toBe('this-week');
  });

  it('says when the closing date has passed', async () => {
    const host = await render('2026-03-07');
    expect(host.textContent?.trim()).toBe('passed 3 days ago');
    expect(host.dataset['urgency']).toBe('passed');
  });
});
