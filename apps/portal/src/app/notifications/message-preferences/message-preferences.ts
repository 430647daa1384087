import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Delivery, NotificationPreference } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { NotificationsApi } from '../notifications-api';

/** Which e-mails a person gets, each at once, in the daily digest, or not at all. */
@Component({
  selector: 'cc-message-preferences',
  imports: [MatButtonModule, MatButtonToggleModule, MatProgressBarModule],
  templateUrl: './message-preferences.html',
  styleUrl: './message-preferences.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MessagePreferences {
  private readonly api = inject(NotificationsApi);
  private readonly notice = inject(Notice);

  protected readonly preferences = signal<NotificationPreference[] | null>(null);
  protected readonly isBusy = signal(false);

  constructor() {
    this.api.preferences().subscribe({ next: (p) => this.preferences.set(p), error: (err: unknown) => this.notice.failure(err) });
  }

  protected choose(preference: NotificationPreference, delivery: Delivery): void {
    this.preferences.update((list) => list?.map((p) => (p.kind === preference.kind ? { ...p, delivery } : p)) ?? null);
  }

  protected save(): void {
    const list = this.preferences();
    if (!list) return;
    this.isBusy.set(true);
    this.api.savePreferences(list.map(({ kind, delivery }) => ({ kind, delivery }))).subscribe({
      next: (saved) => {
        this.preferences.set(saved);
        this.isBusy.set(false);
        this.notice.success('Your e-mail choices are saved.');
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.notice.failure(err);
      },
    });
  }
}
