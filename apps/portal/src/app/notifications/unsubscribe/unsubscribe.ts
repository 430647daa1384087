import { ChangeDetectionStrategy, Component, computed, inject, input, OnInit, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { RouterLink } from '@angular/router';
import { describeFailure } from '../../core/http/api-error-of';
import { NotificationsApi } from '../notifications-api';

type State = { step: 'loading' } | { step: 'ask'; email: string } | { step: 'done'; email: string } | { step: 'failed'; message: string };

/** The page a digest's “Stop the daily digest” link opens: no sign-in needed, one button. */
@Component({
  selector: 'cc-unsubscribe',
  imports: [MatButtonModule, MatCardModule, RouterLink],
  templateUrl: './unsubscribe.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Unsubscribe implements OnInit {
  private readonly api = inject(NotificationsApi);
  readonly token = input.required<string>();
  protected readonly state = signal<State>({ step: 'loading' });
  protected readonly isBusy = signal(false);
  protected readonly email = computed(() => {
    const s = this.state();
    return s.step === 'ask' || s.step === 'done' ? s.email : '';
  });
  protected readonly failure = computed(() => {
    const s = this.state();
    return s.step === 'failed' ? s.message : '';
  });

  ngOnInit(): void {
    this.api.unsubscribeLookup(this.token()).subscribe({
      next: ({ email }) => this.state.set({ step: 'ask', email }),
      error: (err: unknown) => this.state.set({ step: 'failed', message: describeFailure(err) }),
    });
  }

  protected confirm(): void {
    this.isBusy.set(true);
    this.api.unsubscribe(this.token()).subscribe({
      next: ({ email }) => this.state.set({ step: 'done', email }),
      error: (err: unknown) => this.state.set({ step: 'failed', message: describeFailure(err) }),
    });
  }
}
