import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { Auth } from '../../core/auth/auth';
import { AgentDashboardView } from '../agent-dashboard/agent-dashboard';
import { ContractorDashboardView } from '../contractor-dashboard/contractor-dashboard';

/** The dashboard of the signed-in person's role. */
@Component({
  selector: 'cc-dashboard-page',
  imports: [AgentDashboardView, ContractorDashboardView],
  template: `
    <div class="cc-page">
      <h1 data-testid="dashboard-heading">Dashboard</h1>
      @if (auth.role() === 'contractor') {
        <cc-contractor-dashboard />
      } @else {
        <cc-agent-dashboard />
      }
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DashboardPage {
  protected readonly auth = inject(Auth);
}
