import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { LineItem } from '@cc/shared';

type Note = NonNullable<LineItem['editionNote']>;

/** When the NEC began to ask for a missing protection here, offered as information beside the item. */
@Component({
  selector: 'cc-edition-note',
  imports: [MatIconModule],
  template: `
    <details data-testid="edition-note">
      <summary><mat-icon aria-hidden="true">info</mat-icon>{{ summary() }}</summary>
      <p>{{ note().text }}</p>
      <p class="reference">NFPA 70 {{ note().reference }}</p>
    </details>
  `,
  styleUrl: './edition-note.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EditionNote {
  readonly note = input.required<Note>();

  protected readonly summary = computed(() => {
    const since = this.note().requiredSince;
    return since === null ? 'Code edition: information' : `Code edition: in the NEC since ${since} (information)`;
  });
}
