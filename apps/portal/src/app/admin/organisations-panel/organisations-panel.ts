import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Organisation, ORGANISATION_KIND_LABELS } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { pagedList } from '../../core/http/paged-list';
import { AdminApi } from '../admin-api';
import { OrganisationForm } from '../organisation-form/organisation-form';

@Component({
  selector: 'cc-organisations-panel',
  imports: [MatTableModule, MatPaginatorModule, MatProgressBarModule, OrganisationForm],
  templateUrl: './organisations-panel.html',
  styleUrl: '../admin-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrganisationsPanel {
  private readonly api = inject(AdminApi);
  private readonly notice = inject(Notice);

  protected readonly columns = ['name', 'kind', 'licence', 'phone'];
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
}
