import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ReadingEvaluation, ReadingStatus } from '@cc/shared';

const VERDICTS: Record<ReadingStatus, { text: string; icon: string }> = {
  within: { text: 'Within range', icon: 'check_circle' },
  outside: { text: 'Outside range', icon: 'error' },
  flag: { text: 'Within limit, check', icon: 'info' },
  recorded: { text: 'Recorded', icon: 'edit_note' },
};

/** Test readings with their verdict beside each, what was expected, and the source it is judged by. */
@Component({
  selector: 'cc-reading-list',
  imports: [MatIconModule, MatTooltipModule],
  templateUrl: './reading-list.html',
  styleUrl: './reading-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReadingList {
  readonly evaluations = input.required<readonly ReadingEvaluation[]>();
  protected readonly verdicts = VERDICTS;
}
