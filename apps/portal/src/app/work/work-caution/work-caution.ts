import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { WORK_SAFETY_CAUTION } from '@cc/shared';

/** The caution every on-site work screen shows once: de-energise, verify, licensed persons, local code. */
@Component({
  selector: 'cc-work-caution',
  imports: [MatIconModule],
  template: '<mat-icon aria-hidden="true">warning</mat-icon><p>{{ text }}</p>',
  styleUrl: './work-caution.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { role: 'note', 'aria-label': 'Safety caution', 'data-testid': 'work-caution' },
})
export class WorkCaution {
  protected readonly text = WORK_SAFETY_CAUTION;
}
