import { TestBed } from '@angular/core/testing';
import { evaluateReadings, ReadingsSchema } from '@cc/shared';
import { ReadingList } from './reading-list';

describe('ReadingList', () => {
  async function render(readings: unknown, labels: string[] = []) {
    const fixture = TestBed.createComponent(ReadingList);
    fixture.componentRef.setInput('evaluations', evaluateReadings(ReadingsSchema.parse(readings), { labels }));
    fixture.detectChanges();
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('shows a trip time beyond the UL 943 limit as outside the range, with the source', async () => {
    // UL 943: at 20 mA a Class A GFCI trips within (20/20)^1.43 = 1 s.
    const host = await render({ gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 1500, testCurrentMa: 20 } });
    const trip = host.querySelector('[data-testid="reading-gfci.tripTimeMs"]')!;
    expect(trip.getAttribute('data-status')).toBe('outside');
    expect(trip.textContent).toContain('Outside range');
    expect(trip.textContent).toContain('At most 1000 ms');
    expect(trip.textContent).toContain('UL 943');
  });

  it('shows a ground path far above the NEC Chapter 9 Table 8 value as worth a look', async () => {
    const host = await render({ groundPath: { impedanceOhms: 0.7, conductorSize: '12', runLengthFt: 50, temperatureC: 20 } });
    const line = host.querySelector('[data-testid="reading-groundPath.impedanceOhms"]')!;
    expect(line.getAttribute('data-status')).toBe('flag');
    expect(line.textContent).toContain('poor connection');
    expect(line.textContent).toContain('Chapter 9 Table 8');
  });

  it('says when there is nothing to show', async () => {
    const host = await render({});
    expect(host.textContent).toContain('No test readings for this item.');
  });
});
