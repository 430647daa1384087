import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { ROLE_LABELS, User } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { pagedList } from '../../core/http/paged-list';
import { AdminApi } from '../admin-api';
import { askToConfirm } from '../../ui/confirm-dialog/confirm-dialog';
import { TemporaryPasswordData, TemporaryPasswordDialog } from '../temporary-password-dialog/temporary-password-dialog';
import { UserEditDialog } from '../user-edit-dialog/user-edit-dialog';
import { UserForm } from '../user-form/user-form';

@Component({
  selector: 'cc-users-panel',
  imports: [MatTableModule, MatPaginatorModule, MatProgressBarModule, MatButtonModule, UserForm],
  templateUrl: './users-panel.html',
  styleUrl: '../admin-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPanel {
  private readonly api = inject(AdminApi);
  private readonly notice = inject(Notice);
  private readonly dialog = inject(MatDialog);

  protected readonly columns = ['name', 'email', 'role', 'organisation', 'status', 'actions'];
  protected readonly list = pagedList(
    (request) => this.api.users(request),
    (err) => this.notice.failure(err),
  );

  protected roleLabel(user: User): string {
    return ROLE_LABELS[user.role];
  }

  protected added(name: string): void {
    this.notice.success(`Account for ${name} made.`);
    this.list.reload();
  }

  protected edit(user: User): void {
    this.dialog
      .open<UserEditDialog, User, User>(UserEditDialog, { data: user, width: '480px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.notice.success(`${saved.name} saved.`);
        this.list.reload();
      });
  }

  protected setActive(user: User, isActive: boolean): void {
    const message = isActive
      ? `${user.name} can sign in again with their password.`
      : `${user.name} is signed out at once and cannot sign in until the account is reactivated. Their requests stay as they are.`;
    askToConfirm(this.dialog, { title: isActive ? `Reactivate ${user.name}?` : `Deactivate ${user.name}?`, message, confirmLabel: isActive ? 'Reactivate' : 'Deactivate' }).subscribe((isSure) => {
      if (!isSure) return;
      this.api.setUserActive(user.id, isActive).subscribe({
        next: (saved) => {
          this.notice.success(saved.isActive ? `${saved.name} can sign in again.` : `${saved.name} is deactivated and signed out.`);
          this.list.reload();
        },
        error: (err: unknown) => this.notice.failure(err),
      });
    });
  }

  protected resetPassword(user: User): void {
    const message = `${user.name} gets a temporary password, shown to you once, and is signed out everywhere. Their current password stops working.`;
    askToConfirm(this.dialog, { title: `Reset ${user.name}'s password?`, message, confirmLabel: 'Reset password' }).subscribe((isSure) => {
      if (!isSure) return;
      this.api.resetPassword(user.id).subscribe({
        next: ({ temporaryPassword }) =>
          this.dialog.open<TemporaryPasswordDialog, TemporaryPasswordData>(TemporaryPasswordDialog, {
            data: { name: user.name, email: user.email, temporaryPassword },
            width: '520px',
            maxWidth: '95vw',
            disableClose: true,
          }),
        error: (err: unknown) => this.notice.failure(err),
      });
    });
  }
}
