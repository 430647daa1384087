import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Party, PARTY_ROLE_LABELS } from '@cc/shared';
import { Notice } from '../../core/http/notice';

/** The people named on a request; agents also see pending invitation links to pass on. */
@Component({
  selector: 'cc-party-list',
  imports: [ClipboardModule, MatButtonModule, MatIconModule, MatTooltipModule],
  templateUrl: './party-list.html',
  styleUrl: './party-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PartyList {
  private readonly notice = inject(Notice);

  readonly parties = input.required<Party[]>();
  /** Whether invitation links are shown (to the agents of the request). */
  readonly showsInviteLinks = input(false);

  protected readonly roleLabels = PARTY_ROLE_LABELS;

  protected linkCopied(isCopied: boolean): void {
    if (isCopied) this.notice.success('Invitation link copied.');
  }
}
