import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import {
  CONDUCTOR_SIZES,
  CORRECTION_LABELS,
  CORRECTION_OUTCOME_LABELS,
  CORRECTION_OUTCOMES,
  evaluateReadings,
  MAX_PHOTO_BYTES,
  MAX_PHOTOS_PER_KIND,
  PHOTO_KINDS,
  PhotoKind,
  READING_KIND_LABELS,
  readingsToJudge,
  RecordCorrectionSchema,
  RETURN_CAUSE_LABELS,
  RETURN_CAUSES,
  ReturnCause,
  labelsApplyTo,
  missingProof,
  missingProofMessage,
  placeLabel,
  proofReadingsFor,
  codeReferenceText,
} from '@cc/shared';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { issuesOf } from '../../core/forms/issues-of';
import { describeFailure } from '../../core/http/api-error-of';
import { apiErrorOf } from '../../core/http/api-error-of';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { codeLabel } from '../../ui/code-label';
import { ReadingList } from '../reading-list/reading-list';
import { ChosenPhoto, WorkApi } from '../work-api';
import { WorkCaution } from '../work-caution/work-caution';
import { isPhotoFile, PHOTO_ACCEPT, photoRefusal } from './photo-type';
import { readingsOf, readingsForm } from './readings-form';

/**
 * The outcome of one approved item, recorded on site from a phone: what was done, the device
 * installed, labels, test readings judged as they are typed, and before/after photos.
 */
@Component({
  selector: 'cc-correction-form',
  imports: [
    RouterLink,
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    ErrorMessagePipe,
    ReadingList,
    WorkCaution,
  ],
  templateUrl: './correction-form.html',
  styleUrl: './correction-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CorrectionForm {
  private readonly api = inject(WorkApi);
  private readonly router = inject(Router);
  private readonly notice = inject(Notice);
  private readonly fb = inject(FormBuilder).nonNullable;

  /** Route parameters. */
  readonly id = input.required<string>();
  readonly itemId = input.required<string>();

  protected readonly work = rxResource({ params: () => Number(this.id()), stream: ({ params }) => this.api.overview(params) });
  protected readonly loadError = computed(() => (this.work.error() ? describeFailure(this.work.error()) : null));
  protected readonly item = computed(() => (this.work.hasValue() ? (this.work.value().items.find((i) => i.id === Number(this.itemId())) ?? null) : null));
  protected readonly visits = computed(() => (this.work.hasValue() ? this.work.value().visits : []));

  protected readonly outcomes = CORRECTION_OUTCOMES.map((value) => ({ value, label: CORRECTION_OUTCOME_LABELS[value] }));
  protected readonly labelOptions = CORRECTION_LABELS;
  /** The labels are offered only on the items they mark (receptacles on GFCI protection). */
  protected readonly labelsApplyTo = labelsApplyTo;
  protected readonly place = placeLabel;
  protected readonly codeRefs = codeReferenceText;
  protected readonly sizes = CONDUCTOR_SIZES;
  protected readonly kindLabels = READING_KIND_LABELS;
  /** The readings of which one proves a correction of this item (shown beside the readings). */
  protected readonly proofKinds = computed(() => {
    const item = this.item();
    return item ? proofReadingsFor(item.code).map((k) => READING_KIND_LABELS[k]) : [];
  });
  protected readonly codeLabel = codeLabel;
  protected readonly maxPhotoMb = MAX_PHOTO_BYTES / 1024 / 1024;
  protected readonly photoKinds = PHOTO_KINDS;
  protected readonly photoAccept = PHOTO_ACCEPT;

  protected readonly form = this.fb.group({
    outcome: this.fb.control<(typeof CORRECTION_OUTCOMES)[number]>('corrected'),
    workPerformed: [''],
    reason: [''],
    materials: [''],
    deviceMake: [''],
    deviceModel: [''],
    deviceLot: [''],
    labels: this.fb.group(Object.fromEntries(CORRECTION_LABELS.map((l) => [l, false])) as Record<(typeof CORRECTION_LABELS)[number], boolean>),
    siteVisitId: this.fb.control<number | null>(null),
    finishedOnFirstVisit: [true],
    returnCause: this.fb.control<ReturnCause | null>(null),
    readings: readingsForm(this.fb),
  });
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly outcome = computed(() => this.value().outcome);
  /** Whether to ask why the item needs (or needed) another visit. */
  protected readonly asksReturnCause = computed(() => {
    const v = this.value();
    return v.outcome === 'not-corrected' || (v.outcome === 'corrected' && v.finishedOnFirstVisit === false);
  });
  protected readonly returnCauses = RETURN_CAUSES.map((value) => ({ value, label: RETURN_CAUSE_LABELS[value] }));
  protected readonly chosenLabels = computed(() => CORRECTION_LABELS.filter((l) => this.value().labels?.[l]));
  /** The readings as typed, judged as they are typed (null while a number is incomplete). */
  protected readonly evaluations = computed(() => {
    this.value();
    const item = this.item();
    if (!item) return [];
    // Each reading is judged as soon as it is complete, even while another is out of range.
    const { readings, unjudged } = readingsToJudge(readingsOf(this.form.controls.readings.getRawValue(), item.readingKinds));
    return evaluateReadings(readings, { labels: this.chosenLabels() }).filter((e) => !unjudged.includes(e.key));
  });
  /**
   * Readings outside their expected range while the outcome is "Corrected": the item is then recorded
   * as corrected only with a note saying why (shown on the letter beside the reading), or as "Could not correct".
   */
  protected readonly outsideReadings = computed(() => (this.outcome() === 'corrected' ? this.evaluations().filter((e) => e.status === 'outside') : []));

  protected readonly photos = signal<ChosenPhoto[]>([]);
  protected readonly photoError = signal<string | null>(null);
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);

  constructor() {
    effect(() => {
      const item = this.item();
      if (item && this.form.controls.siteVisitId.value === null) this.form.controls.siteVisitId.setValue(item.siteVisitId);
    });
  }

  protected photosOf(kind: PhotoKind): ChosenPhoto[] {
    return this.photos().filter((p) => p.kind === kind);
  }

  protected async choose(kind: PhotoKind, input: HTMLInputElement): Promise<void> {
    this.photoError.set(null);
    const files = Array.from(input.files ?? []);
    input.value = '';
    const tooBig = files.find((f) => f.size > MAX_PHOTO_BYTES);
    if (tooBig) {
      this.photoError.set(`${tooBig.name} is larger than ${this.maxPhotoMb} MB.`);
      return;
    }
    // The bytes decide, not the name: a text file renamed .jpg or a PDF is not a photo.
    for (const file of files) {
      if (!(await isPhotoFile(file))) {
        this.photoError.set(`${file.name} is not a photo: choose a JPEG, PNG, WebP or HEIC photo.`);
        return;
      }
    }
    const kept = [...this.photosOf(kind), ...files.map((file) => ({ kind, file, name: file.name }))].slice(0, MAX_PHOTOS_PER_KIND);
    if (kept.length < this.photosOf(kind).length + files.length) this.photoError.set(`At most ${MAX_PHOTOS_PER_KIND} ${kind} photos.`);
    this.photos.update((all) => [...all.filter((p) => p.kind !== kind), ...kept]);
  }

  protected removePhoto(photo: ChosenPhoto): void {
    this.photos.update((all) => all.filter((p) => p !== photo));
  }

  protected save(): void {
    const item = this.item();
    if (!item) return;
    this.formError.set(null);
    const raw = this.form.getRawValue();
    const isCorrected = raw.outcome === 'corrected';
    // With a reading outside its range, "Corrected" carries the contractor's note in `reason`.
    const needsNote = this.outsideReadings().length > 0;
    const record = {
      outcome: raw.outcome,
      workPerformed: isCorrected ? raw.workPerformed : '',
      reason: isCorrected && !needsNote ? '' : raw.reason,
      materials: isCorrected ? raw.materials : '',
      deviceMake: isCorrected ? raw.deviceMake : '',
      deviceModel: isCorrected ? raw.deviceModel : '',
      deviceLot: isCorrected ? raw.deviceLot : '',
      labels: isCorrected && labelsApplyTo(item.code) ? this.chosenLabels() : [],
      siteVisitId: raw.siteVisitId,
      finishedOnFirstVisit: isCorrected ? raw.finishedOnFirstVisit : false,
      returnCause: this.asksReturnCause() ? raw.returnCause : null,
      readings: isCorrected ? readingsOf(raw.readings, item.readingKinds) : {},
    };
    const parsed = RecordCorrectionSchema.safeParse(record);
    const unproven = parsed.success && isCorrected ? missingProof(item.code, parsed.data.readings) : [];
    if (!parsed.success || unproven.length) {
      const issues = parsed.success ? [{ path: 'readings', message: missingProofMessage(unproven) }] : issuesOf(parsed.error);
      const unmatched = applyIssues(this.form, issues);
      this.formError.set(unmatched.length ? unmatched.map((i) => `${i.path}: ${i.message}`).join(' ') : 'Some fields need attention.');
      return;
    }
    this.isBusy.set(true);
    const photos = isCorrected ? this.photos() : this.photos().filter((p) => p.kind === 'before');
    this.api.recordCorrection(Number(this.id()), item.id, record, photos).subscribe({
      next: () => {
        this.isBusy.set(false);
        this.notice.success('Outcome recorded.');
        void this.router.navigate(['/requests', this.id(), 'work']);
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        const names = { before: photos.filter((p) => p.kind === 'before').map((p) => p.name), after: photos.filter((p) => p.kind === 'after').map((p) => p.name) };
        const refusal = photoRefusal(apiErrorOf(err)?.details ?? [], names);
        if (refusal) {
          this.photoError.set(`${refusal} Remove it and choose another.`);
          this.formError.set('A photo was refused: see Photos.');
          return;
        }
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
