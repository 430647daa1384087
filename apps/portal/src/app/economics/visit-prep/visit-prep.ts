import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MAX_INTAKE_PHOTOS, statesAllowing, type RequestStatus, VisitPrep as VisitPrepData } from '@cc/shared';
import { describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { EconomicsApi } from '../economics-api';

export interface PrepItem {
  id: number;
  label: string;
}

/**
 * What to know before the truck rolls: the photos the agents or the seller attached at intake and,
 * on the visit screen, the report's evidence for each item. The agents and the seller add photos here.
 */
@Component({
  selector: 'cc-visit-prep',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './visit-prep.html',
  styleUrl: './visit-prep.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VisitPrep {
  private readonly api = inject(EconomicsApi);
  private readonly notice = inject(Notice);

  readonly requestId = input.required<number>();
  /** The request's items, to name what a photo or an excerpt is about. */
  readonly items = input<readonly PrepItem[]>([]);
  /** Whether to list the report's evidence per item (the visit screen does). */
  readonly showEvidence = input(false);
  /** The request's status, when the page knows it: past the visits, nobody adds photos any more. */
  readonly status = input<RequestStatus | null>(null);
  /** Whether the request is past the states in which photos are added (the flow table's add-intake-photo). */
  protected readonly isPastPhotos = computed(() => {
    const status = this.status();
    return status !== null && !statesAllowing('add-intake-photo').includes(status);
  });

  /** The photos and evidence, read again whenever the request changes (and after an upload). */
  protected readonly prep = rxResource({ params: () => this.requestId(), stream: ({ params }) => this.api.visitPrep(params) });
  protected readonly data = computed<VisitPrepData | null>(() => (this.prep.hasValue() ? this.prep.value() : null));
  protected readonly files = signal<File[]>([]);
  protected readonly itemId = signal<number | null>(null);
  protected readonly caption = signal('');
  protected readonly error = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly max = MAX_INTAKE_PHOTOS;
  protected readonly evidence = computed(() => {
    const d = this.data();
    if (!d) return [];
    return d.evidence.map((e) => ({ ...e, label: this.labelOf(e.itemId), photos: d.photos.filter((p) => p.itemId === e.itemId) }));
  });

  constructor() {
    effect(() => {
      const failure = this.prep.error();
      if (failure) this.notice.failure(failure);
    });
  }

  protected labelOf(itemId: number | null): string {
    if (itemId === null) return 'The property';
    return this.items().find((i) => i.id === itemId)?.label ?? `Item ${itemId}`;
  }

  protected pick(input: HTMLInputElement): void {
    this.error.set(null);
    this.files.set(Array.from(input.files ?? []));
  }

  protected upload(input: HTMLInputElement): void {
    const files = this.files();
    if (!files.length) {
      this.error.set('Choose a photo first.');
      return;
    }
    if (this.caption().includes('\u0000') || this.caption().length > 200) {
      this.error.set('Use at most 200 characters for the caption.');
      return;
    }
    this.isBusy.set(true);
    this.api.addIntakePhotos(this.requestId(), files, this.itemId(), this.caption().trim()).subscribe({
      next: () => {
        this.isBusy.set(false);
        this.files.set([]);
        this.caption.set('');
        input.value = '';
        this.notice.success(files.length === 1 ? 'Photo added.' : `${files.length} photos added.`);
        this.prep.reload();
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.error.set(describeFailure(err));
      },
    });
  }
}
