import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  CreateLineItemSchema,
  FINDING_CODE_TABLE,
  FINDING_CODES,
  FindingCode,
  LineItem,
  Room,
  ROOMS,
  Severity,
  SEVERITIES,
  UpdateLineItemSchema,
} from '@cc/shared';
import { Observable } from 'rxjs';
import type { z } from 'zod';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { TextSelection } from '../evidence-view/selection-offsets';
import { IntakeApi } from '../intake-api';
import { conflictMessage, ReviewOutcome } from '../review-outcome';
import { ROOM_LABELS } from '../room-labels';
import { SEVERITY_LABELS } from '../severity-labels';

export interface ItemEditData {
  requestId: number;
  /** The item to change; null to add a new one. */
  item: LineItem | null;
  /** For a new item: the report text it rests on. */
  selection: (TextSelection & { reportFileId: number }) | null;
}

const field = UpdateLineItemSchema.shape;

/** Changes every field of one item, or adds an item the reader missed (from selected report text). */
@Component({
  selector: 'cc-item-edit-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './item-edit-dialog.html',
  styleUrl: './item-edit-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ItemEditDialog {
  private readonly api = inject(IntakeApi);
  private readonly dialogRef = inject<MatDialogRef<ItemEditDialog, ReviewOutcome>>(MatDialogRef);
  private readonly fb = inject(FormBuilder).nonNullable;
  protected readonly data = inject<ItemEditData>(MAT_DIALOG_DATA);

  protected readonly codes = FINDING_CODES.map((code) => ({ code, label: FINDING_CODE_TABLE[code].label }));
  protected readonly rooms = ROOMS.map((room) => ({ room, label: ROOM_LABELS[room] }));
  protected readonly severities = SEVERITIES.map((severity) => ({ severity, label: SEVERITY_LABELS[severity] }));

  private readonly item = this.data.item;
  protected readonly form = this.fb.group({
    code: this.fb.control<FindingCode | null>(this.item?.code ?? null, zodValidator(field.code.unwrap())),
    room: this.fb.control<Room | null>(this.item?.room ?? null, zodValidator(field.room.unwrap())),
    location: [this.item?.location ?? '', zodValidator(field.location)],
    quantity: this.fb.control<number | null>(this.item?.quantity ?? null, zodValidator(field.quantity)),
    severity: this.fb.control<Severity | null>(this.item?.severity ?? null),
    necRefs: [this.item?.necRefs.join(', ') ?? ''],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected save(): void {
    this.formError.set(null);
    const request = this.item ? this.updateRequest(this.item) : this.createRequest();
    if (!request) {
      this.form.markAllAsTouched();
      return;
    }
    this.isBusy.set(true);
    request.subscribe({
      next: () => this.dialogRef.close({ kind: 'saved' }),
      error: (err: unknown) => {
        this.isBusy.set(false);
        const conflict = conflictMessage(err);
        if (conflict) this.dialogRef.close({ kind: 'conflict', message: conflict });
        else this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }

  private updateRequest(item: LineItem): Observable<unknown> | null {
    const v = this.form.getRawValue();
    const necRefs = v.necRefs.split(',').map((ref) => ref.trim()).filter(Boolean);
    const parsed = UpdateLineItemSchema.safeParse({ ...v, severity: v.severity ?? undefined, necRefs, version: item.version });
    if (!this.accepts(parsed)) return null;
    return this.api.update(this.data.requestId, item.id, parsed.data);
  }

  private createRequest(): Observable<unknown> | null {
    const v = this.form.getRawValue();
    const selection = this.data.selection;
    const parsed = CreateLineItemSchema.safeParse({
      code: v.code ?? undefined,
      room: v.room ?? undefined,
      location: v.location,
      quantity: v.quantity,
      severity: v.severity ?? undefined,
      reportFileId: selection?.reportFileId ?? null,
      evidenceStart: selection?.start ?? null,
      evidenceEnd: selection?.end ?? null,
    });
    if (!this.accepts(parsed)) return null;
    return this.api.add(this.data.requestId, parsed.data);
  }

  /** Whether the form's values make a valid DTO; if not, the messages go onto the fields. */
  private accepts<T>(parsed: z.ZodSafeParseResult<T>): parsed is z.ZodSafeParseSuccess<T> {
    if (parsed.success) return true;
    // A bad reference in the list belongs to the one field that holds them all.
    const issues = issuesOf(parsed.error).map((i) => ({ ...i, path: i.path.replace(/^necRefs\.\d+$/, 'necRefs') }));
    const unmatched = applyIssues(this.form, issues);
    if (unmatched.length) this.formError.set(unmatched.map((i) => i.message).join(' '));
    return false;
  }
}
