import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { DayPlanSettings, LatitudeSchema, LongitudeSchema, ShopAddressSchema, STATE_TIME_ZONES, UpdateDayPlanSettingsSchema, US_STATES, US_TIME_ZONES } from '@cc/shared';
import { applyIssues } from '../../core/forms/apply-issues';
import { ErrorMessagePipe } from '../../core/forms/error-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { applyServerErrors } from '../../core/http/apply-server-errors';
import { Notice } from '../../core/http/notice';
import { DayPlanApi } from '../day-plan-api';

const fields = UpdateDayPlanSettingsSchema.shape;
const shop = ShopAddressSchema.shape;

/** The organisation's planning settings: drive assumptions, the working day and the shop's address. */
@Component({
  selector: 'cc-settings-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ErrorMessagePipe],
  templateUrl: './settings-page.html',
  styleUrl: './settings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  private readonly api = inject(DayPlanApi);
  private readonly notice = inject(Notice);
  private readonly fb = inject(FormBuilder).nonNullable;

  protected readonly states = US_STATES;
  protected readonly timeZones = US_TIME_ZONES;
  protected readonly saved = signal<DayPlanSettings | null>(null);
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly form = this.fb.group({
    roadFactorPercent: [130, zodValidator(fields.roadFactorPercent)],
    averageSpeedMph: [30, zodValidator(fields.averageSpeedMph)],
    setupMinutes: [15, zodValidator(fields.setupMinutes)],
    flatItemMinutes: [30, zodValidator(fields.flatItemMinutes)],
    dayStart: ['07:30', zodValidator(fields.dayStart)],
    dayEnd: ['16:30', zodValidator(fields.dayEnd)],
    lunchStart: ['12:00', zodValidator(fields.lunchStart)],
    lunchMinutes: [30, zodValidator(fields.lunchMinutes)],
    /** null: the zone of the shop's state. */
    timeZone: this.fb.control<string | null>(null, zodValidator(fields.timeZone)),
    shop: this.fb.group({
      street: ['', zodValidator(shop.street)],
      city: ['', zodValidator(shop.city)],
      state: ['CO', zodValidator(shop.state)],
      zip: ['', zodValidator(shop.zip)],
      latitude: this.fb.control<number | null>(null, zodValidator(LatitudeSchema.nullable())),
      longitude: this.fb.control<number | null>(null, zodValidator(LongitudeSchema.nullable())),
    }),
  });

  constructor() {
    this.api.settings().subscribe({ next: (s) => this.show(s), error: (err: unknown) => this.notice.failure(err) });
  }

  private show(settings: DayPlanSettings): void {
    this.saved.set(settings);
    const { version: _version, isShopLocated: _located, effectiveTimeZone: _zone, ...values } = settings;
    this.form.reset(values);
  }

  /** The zone the shop's state gives, as the form's state field now reads. */
  protected stateZone(): string {
    return STATE_TIME_ZONES[this.form.controls.shop.controls.state.value as keyof typeof STATE_TIME_ZONES] ?? 'UTC';
  }

  protected save(): void {
    const saved = this.saved();
    if (!saved) return;
    this.formError.set(null);
    const raw = this.form.getRawValue();
    const parsed = UpdateDayPlanSettingsSchema.safeParse({ ...raw, shop: { ...raw.shop, latitude: raw.shop.latitude ?? null, longitude: raw.shop.longitude ?? null }, version: saved.version });
    if (!parsed.success) {
      this.form.markAllAsTouched();
      const rest = applyIssues(this.form, parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })));
      this.formError.set(rest[0]?.message ?? null);
      return;
    }
    this.isBusy.set(true);
    this.api.saveSettings(parsed.data).subscribe({
      next: (s) => {
        this.isBusy.set(false);
        this.show(s);
        this.notice.success('Settings saved. Every day plan uses them from now on.');
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(applyServerErrors(this.form, err));
      },
    });
  }
}
