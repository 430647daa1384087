import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { EntryPricing, FlatPricingSchema, RateBookEntryContentSchema, RateBookEntryRecord, RateBookEntrySchema, TimeAndMaterialsPricingSchema } from '@cc/shared';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { codeLabel } from '../../ui/code-label';
import { pricingSummary } from '../entry-draft';
import { EntryFormData, EntryFormDialog } from '../entry-form-dialog/entry-form-dialog';
import { RateBookApi } from '../rate-book-api';
import { centsToDollars, dollarsToCents, toWholeNumber } from '../units';
import { DOLLARS, textValidator, unitValidator, WHOLE } from '../field-validators';

/** The rate book's entries, with the name and main price of a row editable in place and the rest in a form. */
@Component({
  selector: 'cc-entries-table',
  imports: [ReactiveFormsModule, MatTableModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatTooltipModule, ErrorMessagePipe],
  templateUrl: './entries-table.html',
  styleUrl: './entries-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EntriesTable {
  protected readonly codeLabel = codeLabel;
  private readonly api = inject(RateBookApi);
  private readonly dialog = inject(MatDialog);
  private readonly notice = inject(Notice);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly entries = input.required<RateBookEntryRecord[]>();
  /** Something was saved: the rate book should be read again. */
  readonly changed = output<void>();

  protected readonly columns = ['name', 'code', 'unit', 'price', 'actions'];
  protected readonly summary = pricingSummary;
  /** The entry being edited in its row, if any. */
  protected readonly editingId = signal<number | null>(null);
  protected readonly rowError = signal<string | null>(null);
  protected readonly inline = this.fb.group({
    name: ['', textValidator(RateBookEntrySchema.shape.name, 'Name the entry')],
    /** Labour minutes (time and materials) or the first-unit price in dollars (flat). */
    main: [''],
    /** The each-additional price in dollars (flat only). */
    additional: [''],
  });

  protected edit(entry: RateBookEntryRecord): void {
    const p = entry.pricing;
    this.rowError.set(null);
    this.editingId.set(entry.id);
    this.inline.reset({
      name: entry.name,
      main: p.mode === 'flat' ? centsToDollars(p.firstUnitCents) : String(p.labourMinutesPerUnit),
      additional: p.mode === 'flat' ? centsToDollars(p.additionalUnitCents) : '',
    });
    const { main, additional } = this.inline.controls;
    if (p.mode === 'flat') {
      main.setValidators(unitValidator(DOLLARS, FlatPricingSchema.shape.firstUnitCents));
      additional.setValidators(unitValidator(DOLLARS, FlatPricingSchema.shape.additionalUnitCents));
    } else {
      main.setValidators(unitValidator(WHOLE, TimeAndMaterialsPricingSchema.shape.labourMinutesPerUnit));
      additional.clearValidators();
    }
    main.updateValueAndValidity();
    additional.updateValueAndValidity();
  }

  protected cancel(): void {
    this.editingId.set(null);
  }

  protected saveInline(entry: RateBookEntryRecord): void {
    if (this.inline.invalid) {
      this.inline.markAllAsTouched();
      return;
    }
    const { name, main, additional } = this.inline.getRawValue();
    const p = entry.pricing;
    const pricing: EntryPricing =
      p.mode === 'flat'
        ? { ...p, firstUnitCents: dollarsToCents(main)!, additionalUnitCents: dollarsToCents(additional)! }
        : { ...p, labourMinutesPerUnit: toWholeNumber(main)! };
    const checked = RateBookEntryContentSchema.safeParse({ code: entry.code, name, unit: entry.unit, pricing });
    if (!checked.success) {
      const issues = issuesOf(checked.error).map((i) => ({ ...i, path: i.path === 'pricing.additionalUnitCents' ? 'additional' : i.path }));
      const rest = applyIssues(this.inline, issues);
      this.rowError.set(rest.map((i) => i.message).join(' ') || null);
      return;
    }
    this.api.updateEntry(entry.id, { version: entry.version, name: checked.data.name, pricing: checked.data.pricing }).subscribe({
      next: () => {
        this.editingId.set(null);
        this.notice.success(`${checked.data.name} saved.`);
        this.changed.emit();
      },
      error: (err: unknown) => {
        const isStale = err instanceof HttpErrorResponse && err.status === 409;
        this.rowError.set(isStale ? 'Someone changed this entry meanwhile. Reload the rate book.' : applyServerErrors(this.inline, err));
      },
    });
  }

  protected openForm(entry: RateBookEntryRecord | null): void {
    this.dialog
      .open<EntryFormDialog, EntryFormData, RateBookEntryRecord>(EntryFormDialog, { data: { entry }, width: '760px', maxWidth: '96vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.notice.success(`${saved.name} saved.`);
        this.changed.emit();
      });
  }

  protected remove(entry: RateBookEntryRecord): void {
    if (!window.confirm(`Delete “${entry.name}”? Sent quotes keep the version they were priced with.`)) return;
    this.api.deleteEntry(entry.id, entry.version).subscribe({
      next: () => {
        this.notice.success(`${entry.name} deleted.`);
        this.changed.emit();
      },
      error: (err: unknown) => this.notice.failure(err),
    });
  }
}
