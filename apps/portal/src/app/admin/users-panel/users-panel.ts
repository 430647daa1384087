import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { ROLE_LABELS, User } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { pagedList } from '../../core/http/paged-list';
import { AdminApi } from '../admin-api';
import { UserForm } from '../user-form/user-form';

@Component({
  selector: 'cc-users-panel',
  imports: [MatTableModule, MatPaginatorModule, MatProgressBarModule, UserForm],
  templateUrl: './users-panel.html',
  styleUrl: '../admin-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPanel {
  private readonly api = inject(AdminApi);
  private readonly notice = inject(Notice);

  protected readonly columns = ['name', 'email', 'role', 'organisation'];
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
}
