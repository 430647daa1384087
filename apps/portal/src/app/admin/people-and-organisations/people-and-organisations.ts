import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { OrganisationsPanel } from '../organisations-panel/organisations-panel';
import { UsersPanel } from '../users-panel/users-panel';

/** The administrator's page: organisations in one tab, user accounts in the other. */
@Component({
  selector: 'cc-people-and-organisations',
  imports: [MatTabsModule, OrganisationsPanel, UsersPanel],
  templateUrl: './people-and-organisations.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleAndOrganisations {}
