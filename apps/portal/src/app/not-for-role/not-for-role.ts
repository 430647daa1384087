import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { Router, RouterLink } from '@angular/router';
import { listWords, ROLE_LABELS } from '@cc/shared';
import { WrongRoleInfo } from '../core/auth/has-role-guard';

/** Shown at the address of a page that belongs to other roles (e.g. the job queue to a seller). */
@Component({
  selector: 'cc-not-for-role',
  imports: [RouterLink, MatButtonModule],
  template: `
    <div class="cc-page">
      <h1 data-testid="not-for-role-heading">{{ info.page }} is not part of your account</h1>
      <p data-testid="not-for-role-text">
        {{ info.page }} is for {{ whom }}. Your own requests and what they wait for are on your home page.
      </p>
      <a mat-flat-button routerLink="/requests">Go to my requests</a>
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotForRole {
  /** Read once, from the navigation that brought the person here. */
  protected readonly info: WrongRoleInfo = (inject(Router).currentNavigation()?.extras.info as WrongRoleInfo | undefined) ?? { page: 'This page', roles: [] };
  protected readonly whom = listWords(this.info.roles.map((r) => `${ROLE_LABELS[r].toLowerCase()}s`)) || 'other roles';
}
