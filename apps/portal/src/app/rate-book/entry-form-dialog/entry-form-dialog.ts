import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  EntryPricing,
  FINDING_CODE_TABLE,
  FINDING_CODES,
  FlatPricingSchema,
  MaterialSchema,
  RateBookEntryContentSchema,
  RateBookEntryRecord,
  RateBookEntrySchema,
  RateBookKeySchema,
  ShareBpSchema,
  TimeAndMaterialsPricingSchema,
} from '@cc/shared';
import { Observable } from 'rxjs';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { formatCents } from '../../ui/money/money';
import { MaterialDraft, materialDraft, materialsTotalCents, pricingDraft, toEntryPricing } from '../entry-draft';
import { RateBookApi } from '../rate-book-api';
import { DOLLARS, FACTOR, PERCENT, textValidator, unitValidator, WHOLE } from '../field-validators';

export interface EntryFormData {
  /** The entry to change; null for a new one. */
  entry: RateBookEntryRecord | null;
}

const tm = TimeAndMaterialsPricingSchema.shape;
const flat = FlatPricingSchema.shape;
const TM_FIELDS = ['labourMinutesPerUnit', 'materialsCentsPerUnit', 'markupBp', 'minutesLow', 'minutesHigh', 'materials'] as const;
const FLAT_FIELDS = ['firstUnitCents', 'additionalUnitCents', 'hardSiteMultiplierBp'] as const;

/** Adds or changes one rate-book entry: time and materials (minutes, materials, markup) or a flat rate. */
@Component({
  selector: 'cc-entry-form-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatButtonToggleModule, MatIconModule, ErrorMessagePipe],
  templateUrl: './entry-form-dialog.html',
  styleUrl: './entry-form-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EntryFormDialog {
  private readonly api = inject(RateBookApi);
  private readonly dialogRef = inject<MatDialogRef<EntryFormDialog, RateBookEntryRecord>>(MatDialogRef);
  private readonly fb = inject(FormBuilder).nonNullable;
  protected readonly data = inject<EntryFormData>(MAT_DIALOG_DATA);

  protected readonly codes = FINDING_CODES.map((code) => ({ code, label: FINDING_CODE_TABLE[code].label }));
  private readonly entry = this.data.entry;
  private readonly start = pricingDraft(this.entry ?? undefined);

  protected readonly form = this.fb.group({
    key: [this.entry?.key ?? '', zodValidator(RateBookKeySchema.optional(), (v) => (v === '' ? undefined : v))],
    code: this.fb.control<string | null>(this.entry?.code ?? null),
    name: [this.entry?.name ?? '', textValidator(RateBookEntrySchema.shape.name, 'Name the entry')],
    unit: [this.entry?.unit ?? 'device', textValidator(RateBookEntrySchema.shape.unit, 'Say what the quantity counts')],
    pricing: this.fb.group({
      mode: this.fb.control<EntryPricing['mode']>(this.start.mode),
      labourMinutesPerUnit: [this.start.labourMinutesPerUnit, unitValidator(WHOLE, tm.labourMinutesPerUnit)],
      materialsCentsPerUnit: [this.start.materialsCentsPerUnit, unitValidator(DOLLARS, tm.materialsCentsPerUnit)],
      markupBp: [this.start.markupBp, unitValidator(PERCENT, ShareBpSchema, true)],
      minutesLow: [this.start.minutesLow, unitValidator(WHOLE, tm.minutesLow)],
      minutesHigh: [this.start.minutesHigh, unitValidator(WHOLE, tm.minutesHigh)],
      materials: this.fb.array(this.start.materials.map((m) => this.materialGroup(m))),
      firstUnitCents: [this.start.firstUnitCents, unitValidator(DOLLARS, flat.firstUnitCents)],
      additionalUnitCents: [this.start.additionalUnitCents, unitValidator(DOLLARS, flat.additionalUnitCents)],
      hardSiteMultiplierBp: [this.start.hardSiteMultiplierBp, unitValidator(FACTOR, flat.hardSiteMultiplierBp)],
    }),
  });
  protected readonly pricing = this.form.controls.pricing.controls;
  protected readonly mode = toSignal(this.pricing.mode.valueChanges, { initialValue: this.start.mode });
  private readonly materialValues = toSignal(this.pricing.materials.valueChanges, { initialValue: this.pricing.materials.getRawValue() });
  /** The cost per unit from the materials list, shown instead of the field while there is a list. */
  protected readonly listedCost = computed(() => {
    const materials = this.materialValues() as MaterialDraft[];
    if (!materials.length) return null;
    const cents = materialsTotalCents(materials);
    return cents === null ? 'check the list' : formatCents(cents);
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  constructor() {
    const destroyRef = inject(DestroyRef);
    this.showFieldsOf(this.start.mode);
    this.pricing.mode.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((mode) => this.showFieldsOf(mode));
    this.pricing.materials.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe(() => this.showFieldsOf(this.pricing.mode.value));
  }

  protected addMaterial(): void {
    this.pricing.materials.push(this.materialGroup(materialDraft()));
  }

  protected removeMaterial(index: number): void {
    this.pricing.materials.removeAt(index);
  }

  protected save(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Some fields need attention.');
      return;
    }
    const { key, code, name, unit, pricing } = this.form.getRawValue();
    const checked = RateBookEntryContentSchema.safeParse({ code, name, unit, pricing: toEntryPricing(pricing) });
    if (!checked.success) {
      const rest = applyIssues(this.form, issuesOf(checked.error));
      this.formError.set(rest.length ? rest.map((i) => i.message).join(' ') : 'Some fields need attention.');
      return;
    }
    const request: Observable<RateBookEntryRecord> = this.entry
      ? this.api.updateEntry(this.entry.id, { version: this.entry.version, ...checked.data })
      : this.api.createEntry({ key: key.trim() || undefined, ...checked.data });
    this.isBusy.set(true);
    request.subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (err: unknown) => {
        this.isBusy.set(false);
        const isStale = err instanceof HttpErrorResponse && err.status === 409;
        this.formError.set(isStale ? 'Someone changed this entry meanwhile. Close this form and reload the rate book.' : (applyServerErrors(this.form, err) ?? 'Some fields need attention.'));
      },
    });
  }

  private materialGroup(m: MaterialDraft): FormGroup<{ name: FormControl<string>; quantityPerUnit: FormControl<string>; unitCostCents: FormControl<string> }> {
    return this.fb.group({
      name: [m.name, textValidator(MaterialSchema.shape.name, 'Name the material')],
      quantityPerUnit: [m.quantityPerUnit, unitValidator(WHOLE, MaterialSchema.shape.quantityPerUnit)],
      unitCostCents: [m.unitCostCents, unitValidator(DOLLARS, MaterialSchema.shape.unitCostCents)],
    });
  }

  /** Only the fields of the chosen mode are checked; with a materials list its sum is the cost per unit. */
  private showFieldsOf(mode: EntryPricing['mode']): void {
    const toggle = (name: (typeof TM_FIELDS)[number] | (typeof FLAT_FIELDS)[number], isOn: boolean) => {
      const control = this.pricing[name];
      if (isOn && control.disabled) control.enable({ emitEvent: false });
      if (!isOn && control.enabled) control.disable({ emitEvent: false });
    };
    for (const name of TM_FIELDS) toggle(name, mode === 'time-and-materials');
    for (const name of FLAT_FIELDS) toggle(name, mode === 'flat');
    if (mode === 'time-and-materials' && this.pricing.materials.length > 0) toggle('materialsCentsPerUnit', false);
  }
}
