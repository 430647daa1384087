import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { RepairRequestDetail } from '@cc/shared';
import { catchError, of } from 'rxjs';
import { describeFailure } from '../../core/http/api-error-of';
import { RequestsApi } from '../requests-api';

/** Lets an agent choose or change the electrical contractor before a quote is sent. */
@Component({
  selector: 'cc-contractor-picker',
  imports: [FormsModule, MatFormFieldModule, MatSelectModule, MatButtonModule],
  templateUrl: './contractor-picker.html',
  styleUrl: './contractor-picker.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ContractorPicker {
  private readonly api = inject(RequestsApi);

  readonly requestId = input.required<number>();
  readonly currentId = input<number | null>(null);
  /** The request as the server answered after the change. */
  readonly changed = output<RepairRequestDetail>();

  protected readonly contractors = toSignal(this.api.contractors().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly chosen = signal<number | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  protected assign(): void {
    const id = this.chosen();
    if (id === null || id === this.currentId()) return;
    this.isBusy.set(true);
    this.error.set(null);
    this.api.assignContractor(this.requestId(), { contractorOrganisationId: id }).subscribe({
      next: (detail) => {
        this.isBusy.set(false);
        this.chosen.set(null);
        this.changed.emit(detail);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.error.set(describeFailure(err));
      },
    });
  }
}
