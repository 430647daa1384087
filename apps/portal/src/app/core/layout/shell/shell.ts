import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { Logo } from '../../../ui/logo/logo';
import { Auth } from '../../auth/auth';
import { Notice } from '../../http/notice';
import { navItemsFor } from '../nav-items';

/** Toolbar, side navigation for the signed-in role, the page, and the footer. */
@Component({
  selector: 'cc-shell',
  imports: [
    MatToolbarModule,
    MatSidenavModule,
    MatListModule,
    MatIconModule,
    MatButtonModule,
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    Logo,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly notice = inject(Notice);

  protected readonly user = this.auth.user;
  protected readonly navItems = computed(() => {
    const role = this.auth.role();
    return role ? navItemsFor(role) : [];
  });
  /** Whether the screen is narrow enough for the navigation to slide over the page. */
  protected readonly isHandset = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 959.98px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );

  protected signOut(): void {
    this.auth.signOut().subscribe({
      next: () => void this.router.navigate(['/sign-in']),
      error: (err: unknown) => this.notice.failure(err),
    });
  }
}
