import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { outputFromObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { BulkPriceItemsSchema, PricingVisit, RateBook } from '@cc/shared';
import { map } from 'rxjs';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { adderEffectLabel } from '../adder-effect-label';
import { codeLabel } from '../../ui/code-label';
import { PendingChange } from '../live-pricing';
import { MoneyPipe } from '../../ui/money/money';
import { VisitLabelPipe } from '../visit-label';

type ChangeSet = PendingChange['set'];

/** Value of the entry select that leaves the entry as it is, and the one that takes it off. */
const KEEP = 'keep';
const NO_ENTRY = 'none';

/** One change (entry, site conditions, quantity, visit) for every selected item, with its live total. */
@Component({
  selector: 'cc-bulk-toolbar',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatSelectModule, MatInputModule, MatCheckboxModule, MatButtonModule, MatIconModule, MoneyPipe, ErrorMessagePipe, VisitLabelPipe],
  templateUrl: './bulk-toolbar.html',
  styleUrl: './bulk-toolbar.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BulkToolbar {
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly rateBook = input.required<RateBook>();
  readonly visits = input.required<PricingVisit[]>();
  /** Finding codes of the request's items, to select all items of one. */
  readonly codes = input.required<string[]>();
  /** Finding codes of the selected items, whose entries are offered first. */
  readonly selectedCodes = input.required<string[]>();
  readonly selectedCount = input.required<number>();
  readonly currentTotalCents = input.required<number>();
  /** The quote total after the change in the form, or null while nothing is chosen or it cannot be priced. */
  readonly previewTotalCents = input.required<number | null>();
  readonly isBusy = input(false);

  readonly selectCode = output<string>();
  readonly apply = output<ChangeSet>();
  readonly declineSelected = output<void>();

  protected readonly keep = KEEP;
  protected readonly noEntry = NO_ENTRY;
  protected readonly form = this.fb.group({
    entry: [KEEP],
    changeAdders: [false],
    adderIds: this.fb.control<number[]>([]),
    quantity: this.fb.control<number | null>(null, zodValidator(BulkPriceItemsSchema.shape.set.shape.quantity)),
    visitKey: [''],
  });

  /** The change the form describes, or null when it changes nothing (or the quantity is not valid). */
  private readonly changeSet = this.form.valueChanges.pipe(map(() => this.toChangeSet()));
  readonly pendingChange = outputFromObservable(this.changeSet);
  protected readonly isChangingAdders = toSignal(this.form.controls.changeAdders.valueChanges, { initialValue: false });
  protected readonly hasChange = toSignal(this.changeSet.pipe(map((set) => set !== null)), { initialValue: false });

  protected readonly entryGroups = computed(() => {
    const codes = new Set(this.selectedCodes());
    const entries = this.rateBook().entries.map((e) => ({ id: Number(e.id), name: e.name, code: e.code, mode: e.pricing.mode }));
    return [
      { label: 'For the selected findings', entries: entries.filter((e) => e.code !== null && codes.has(e.code)) },
      { label: 'Other entries', entries: entries.filter((e) => e.code === null || !codes.has(e.code)) },
    ].filter((group) => group.entries.length > 0);
  });
  protected readonly adders = computed(() =>
    this.rateBook().adders.map((a) => ({ id: Number(a.id), name: a.name, effect: adderEffectLabel(a.effect) })),
  );
  protected readonly codeOptions = computed(() => this.codes().map((code) => ({ code, label: codeLabel(code) })));

  protected pickCode(code: string): void {
    if (code) this.selectCode.emit(code);
  }

  protected applyChange(): void {
    const set = this.toChangeSet();
    if (!set) {
      this.form.markAllAsTouched();
      return;
    }
    this.apply.emit(set);
    this.form.reset();
  }

  private toChangeSet(): ChangeSet | null {
    if (this.form.controls.quantity.invalid) return null;
    const { entry, changeAdders, adderIds, quantity, visitKey } = this.form.getRawValue();
    const set: ChangeSet = {};
    if (entry !== KEEP) set.entryId = entry === NO_ENTRY ? null : Number(entry);
    if (changeAdders) set.adderIds = adderIds;
    if (quantity !== null) set.quantity = quantity;
    if (visitKey) set.visitKey = visitKey;
    return Object.keys(set).length ? set : null;
  }
}
