import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { ItemEditionNote } from '@cc/shared';

/**
 * The code in force when the house was built and the locally adopted edition, for one item: a
 * one-line summary that opens onto the note in plain words (information, never a ruling).
 */
@Component({
  selector: 'cc-edition-note',
  imports: [MatIconModule],
  template: `
    <details data-testid="edition-note">
      <summary><mat-icon aria-hidden="true">history_edu</mat-icon><span data-testid="edition-note-summary">{{ note().summary }}</span></summary>
      <p data-testid="edition-note-text">{{ note().text }}</p>
      <p class="reference">NFPA 70 {{ note().reference }}</p>
    </details>
  `,
  styleUrl: './edition-note.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EditionNote {
  readonly note = input.required<ItemEditionNote>();
}
