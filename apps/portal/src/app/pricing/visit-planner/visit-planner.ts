import { ChangeDetectionStrategy, Component, computed, input, linkedSignal, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { PricingItem, PricingVisit, RateBook } from '@cc/shared';
import { VisitLabelPipe } from '../visit-label';

/** The next free visit key: `visit-2`, `visit-3`, … */
export function nextVisitKey(visits: readonly PricingVisit[]): string {
  let n = visits.length + 1;
  while (visits.some((v) => v.key === `visit-${n}`)) n++;
  return `visit-${n}`;
}

/** The visits of a request: a permit and site conditions for each, and more visits when the work needs them. */
@Component({
  selector: 'cc-visit-planner',
  imports: [MatCheckboxModule, MatSelectModule, MatFormFieldModule, MatButtonModule, MatIconModule, VisitLabelPipe],
  templateUrl: './visit-planner.html',
  styleUrl: './visit-planner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VisitPlanner {
  readonly visits = input.required<PricingVisit[]>();
  readonly items = input.required<PricingItem[]>();
  readonly rateBook = input.required<RateBook>();
  readonly isBusy = input(false);
  readonly save = output<PricingVisit[]>();

  /** The visits as edited here, until saved (a reload from the server starts again). */
  protected readonly draft = linkedSignal(() => this.visits().map((v) => ({ ...v, adderIds: [...v.adderIds] })));
  protected readonly isChanged = computed(() => JSON.stringify(this.draft()) !== JSON.stringify(this.visits()));
  protected readonly adders = computed(() => this.rateBook().adders.map((a) => ({ id: Number(a.id), name: a.name })));
  protected readonly itemCounts = computed(() => {
    const counts = new Map<string, number>();
    for (const item of this.items()) counts.set(item.visitKey, (counts.get(item.visitKey) ?? 0) + 1);
    return counts;
  });

  protected setPermit(key: string, hasPermit: boolean): void {
    this.draft.update((visits) => visits.map((v) => (v.key === key ? { ...v, hasPermit } : v)));
  }

  protected setAdders(key: string, adderIds: number[]): void {
    this.draft.update((visits) => visits.map((v) => (v.key === key ? { ...v, adderIds } : v)));
  }

  protected addVisit(): void {
    this.draft.update((visits) => [...visits, { key: nextVisitKey(visits), adderIds: [], hasPermit: false }]);
  }

  protected removeVisit(key: string): void {
    this.draft.update((visits) => visits.filter((v) => v.key !== key));
  }
}
