import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { FINDING_CODE_TABLE, LineItem, placeLabel, SplitLineItemSchema } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { IntakeApi } from '../intake-api';
import { conflictMessage, ReviewOutcome } from '../review-outcome';

export interface SplitData {
  requestId: number;
  item: LineItem;
}

/** "2, 1" → [2, 1]; anything that is not a whole number stays as NaN so the schema names it. */
export function readQuantities(text: string): number[] {
  return text
    .split(/[,;\s]+/)
    .filter(Boolean)
    .map((part) => (/^\d+$/.test(part) ? Number(part) : Number.NaN));
}

/** Splits one item into several with their own quantities, e.g. 3 receptacles in two rooms → 2 and 1. */
@Component({
  selector: 'cc-split-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './split-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SplitDialog {
  private readonly api = inject(IntakeApi);
  private readonly dialogRef = inject<MatDialogRef<SplitDialog, ReviewOutcome>>(MatDialogRef);
  protected readonly data = inject<SplitData>(MAT_DIALOG_DATA);

  protected readonly label = FINDING_CODE_TABLE[this.data.item.code].label;
  protected readonly place = placeLabel;
  protected readonly form = inject(FormBuilder).nonNullable.group({
    quantities: [this.suggestion(), zodValidator(SplitLineItemSchema.shape.quantities, (v) => readQuantities(String(v ?? '')))],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  /** A first guess: the known quantity cut in two. */
  private suggestion(): string {
    const q = this.data.item.quantity;
    return q !== null && q >= 2 ? `${Math.ceil(q / 2)}, ${Math.floor(q / 2)}` : '1, 1';
  }

  protected split(): void {
    this.formError.set(null);
    const quantities = readQuantities(this.form.controls.quantities.value);
    const parsed = SplitLineItemSchema.safeParse({ version: this.data.item.version, quantities });
    const expected = this.data.item.quantity;
    const sum = quantities.reduce((a, b) => a + b, 0);
    if (!parsed.success || (expected !== null && sum !== expected)) {
      if (parsed.success) {
        this.form.controls.quantities.setErrors({ issue: `The parts add up to ${sum}, but the item has ${expected}` });
      }
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    this.api.split(this.data.requestId, this.data.item.id, parsed.data).subscribe({
      next: () => this.dialogRef.close({ kind: 'saved' }),
      error: (err: unknown) => {
        this.isBusy.set(false);
        const conflict = conflictMessage(err);
        if (conflict) this.dialogRef.close({ kind: 'conflict', message: conflict });
        else this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
