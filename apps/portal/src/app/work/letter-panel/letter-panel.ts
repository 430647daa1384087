import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { FormArray, FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { RouterLink } from '@angular/router';
import { IssueLetterSchema, placeLabel, ProofReviewSchema, WorkOverview } from '@cc/shared';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { codeLabel } from '../../ui/code-label';
import { WorkApi } from '../work-api';

/**
 * The completion letter of a request: its revisions to download and verify, the contractor's form to
 * issue it, and the inspector's (or buyer's agent's) re-inspection review.
 */
@Component({
  selector: 'cc-letter-panel',
  imports: [DatePipe, RouterLink, ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, ErrorMessagePipe],
  templateUrl: './letter-panel.html',
  styleUrl: './letter-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LetterPanel {
  private readonly api = inject(WorkApi);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly overview = input.required<WorkOverview>();
  /** Something changed on the server; the message says what. */
  readonly changed = output<string>();

  protected readonly codeLabel = codeLabel;
  protected readonly place = placeLabel;
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);

  protected readonly issueForm = this.fb.group({
    permitNumber: [''],
    isPermitNotRequired: [false],
    warranty: [''],
    signatureName: [''],
  });

  protected readonly reviewForm = this.fb.group({
    decision: this.fb.control<'accept' | 'not-accept'>('accept'),
    note: [''],
    items: this.fb.array<ReturnType<LetterPanel['itemGroup']>>([]),
  });
  protected readonly correctedItems = computed(() => this.overview().items.filter((i) => i.status === 'done'));
  protected readonly decision = signal<'accept' | 'not-accept'>('accept');

  constructor() {
    effect(() => {
      const items = this.correctedItems();
      const array = this.reviewForm.controls.items as FormArray;
      array.clear();
      for (const item of items) array.push(this.itemGroup(item.id));
    });
  }

  private itemGroup(itemId: number) {
    return this.fb.group({ itemId: [itemId], isNotAccepted: [false], reason: [''] });
  }

  protected issue(): void {
    this.formError.set(null);
    const parsed = IssueLetterSchema.safeParse(this.issueForm.getRawValue());
    if (!parsed.success) {
      const unmatched = applyIssues(this.issueForm, issuesOf(parsed.error));
      this.formError.set(unmatched.length ? unmatched.map((i) => i.message).join(' ') : null);
      return;
    }
    this.isBusy.set(true);
    this.api.issueLetter(this.overview().requestId, parsed.data).subscribe({
      next: (letter) => {
        this.isBusy.set(false);
        this.changed.emit(`Letter ${letter.number} revision ${letter.revision} issued.`);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.issueForm, err));
      },
    });
  }

  protected review(): void {
    this.formError.set(null);
    const raw = this.reviewForm.getRawValue();
    const body =
      raw.decision === 'accept'
        ? { decision: 'accept' as const, note: raw.note }
        : { decision: 'not-accept' as const, note: raw.note, items: raw.items.filter((i) => i.isNotAccepted).map((i) => ({ itemId: i.itemId, reason: i.reason })) };
    const parsed = ProofReviewSchema.safeParse(body);
    if (!parsed.success) {
      this.formError.set(parsed.error.issues[0]?.message ?? 'Check the review');
      return;
    }
    this.isBusy.set(true);
    this.api.review(this.overview().requestId, parsed.data).subscribe({
      next: () => {
        this.isBusy.set(false);
        this.changed.emit(parsed.data.decision === 'accept' ? 'Re-inspection accepted.' : 'Items not accepted sent back to the contractor.');
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.reviewForm, err));
      },
    });
  }
}
