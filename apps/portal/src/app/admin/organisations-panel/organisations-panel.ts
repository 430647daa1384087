import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Organisation, ORGANISATION_KIND_LABELS } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { pagedList } from '../../core/http/paged-list';
import { AdminApi } from '../admin-api';
import { OrganisationEditDialog } from '../organisation-edit-dialog/organisation-edit-dialog';
import { OrganisationForm } from '../organisation-form/organisation-form';

@Component({
  selector: 'cc-organisations-panel',
  imports: [MatTableModule, MatPaginatorModule, MatProgressBarModule, MatButtonModule, OrganisationForm],
  templateUrl: './organisations-panel.html',
  styleUrl: '../admin-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrganisationsPanel {
  private readonly api = inject(AdminApi);
  private readonly notice = inject(Notice);
  private readonly dialog = inject(MatDialog);

  protected readonly columns = ['name', 'kind', 'licence', 'phone', 'actions'];
  protected readonly list = pagedList(
    (request) => this.api.organisations(request),
    (err) => this.notice.failure(err),
  );

  protected kindLabel(organisation: Organisation): string {
    return ORGANISATION_KIND_LABELS[organisation.kind];
  }

  protected added(name: string): void {
    this.notice.success(`${name} added.`);
    this.list.reload();
  }

  protected edit(organisation: Organisation): void {
    this.dialog
      .open<OrganisationEditDialog, Organisation, Organisation>(OrganisationEditDialog, { data: organisation, width: '720px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.notice.success(`${saved.name} saved.`);
        this.list.reload();
      });
  }
}
