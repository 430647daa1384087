import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { BookSiteVisitSchema, SiteVisit, WorkOverview } from '@cc/shared';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { visitLabel } from '../../pricing/visit-label';
import { WorkApi } from '../work-api';

const fields = BookSiteVisitSchema.shape;

/** Books a site visit: date, arrival window, electrician, access notes, and which quoted visit's items it takes. */
@Component({
  selector: 'cc-visit-booking',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, ErrorMessagePipe],
  templateUrl: './visit-booking.html',
  styleUrl: './visit-booking.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VisitBooking {
  private readonly api = inject(WorkApi);
  private readonly fb = inject(FormBuilder).nonNullable;

  readonly overview = input.required<WorkOverview>();
  readonly booked = output<SiteVisit>();

  protected readonly form = this.fb.group({
    date: ['', zodValidator(fields.date)],
    arrivalFrom: ['08:00', zodValidator(fields.arrivalFrom)],
    arrivalTo: ['10:00', zodValidator(fields.arrivalTo)],
    electricianId: this.fb.control<number | null>(null, zodValidator(fields.electricianId)),
    quotedVisitKey: this.fb.control<string | null>(null),
    accessNotes: ['', zodValidator(fields.accessNotes)],
  });
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  /** The quote's visits that still have approved items without a site visit. */
  protected readonly quotedVisits = computed(() => {
    const o = this.overview();
    const open = o.items.filter((i) => i.status === 'approved' && i.siteVisitId === null);
    return o.quotedVisitKeys.filter((key) => open.some((i) => i.quotedVisitKey === key)).map((key) => ({ key, label: `Items of quoted ${visitLabel(key).toLowerCase()}` }));
  });
  protected readonly unplannedCount = computed(() => this.overview().items.filter((i) => i.status === 'approved' && i.siteVisitId === null).length);

  /** Whether the form is open: by default only while approved items wait for a visit. */
  protected readonly isOpen = signal(false);
  protected readonly showsForm = computed(() => this.isOpen() || this.unplannedCount() > 0);

  protected book(formDirective: FormGroupDirective): void {
    this.formError.set(null);
    const parsed = BookSiteVisitSchema.safeParse(this.form.getRawValue());
    if (!parsed.success) {
      this.form.markAllAsTouched();
      this.formError.set(parsed.error.issues.find((i) => i.path[0] === 'arrivalTo')?.message ?? null);
      return;
    }
    this.isBusy.set(true);
    this.api.bookVisit(this.overview().requestId, parsed.data).subscribe({
      next: (visit) => {
        this.isBusy.set(false);
        formDirective.resetForm({ arrivalFrom: '08:00', arrivalTo: '10:00', date: '', electricianId: null, quotedVisitKey: null, accessNotes: '' });
        this.isOpen.set(false);
        this.booked.emit(visit);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
