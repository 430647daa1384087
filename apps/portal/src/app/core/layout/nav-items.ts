import type { Role } from '@cc/shared';

export interface NavItem {
  label: string;
  icon: string;
  link: string;
  /** Stable name for browser tests (`data-testid="nav-<id>"`). */
  id: string;
}

const REQUESTS_LABEL: Record<Role, string> = {
  agent: 'Repair requests',
  seller: 'Repairs for my sale',
  contractor: 'Assigned requests',
  inspector: 'Inspections',
  admin: 'All repair requests',
};

/** The side-navigation entries a role sees, in order (account and sign-out are added by the shell). */
export function navItemsFor(role: Role): NavItem[] {
  const items: NavItem[] = [{ id: 'requests', label: REQUESTS_LABEL[role], icon: 'home_repair_service', link: '/requests' }];
  if (role === 'agent' || role === 'admin' || role === 'contractor') items.push({ id: 'dashboard', label: 'Dashboard', icon: 'dashboard', link: '/dashboard' });
  if (role === 'agent' || role === 'admin') {
    items.push({ id: 'new-request', label: 'Start a request', icon: 'add_home', link: '/requests/new' });
  }
  if (role === 'contractor') {
    items.push(
      { id: 'job-queue', label: 'Job queue', icon: 'request_quote', link: '/pricing' },
      { id: 'rate-book', label: 'Rate book', icon: 'menu_book', link: '/rate-book' },
    );
  }
  if (role === 'admin') {
    items.push(
      { id: 'admin', label: 'People and organisations', icon: 'groups', link: '/admin' },
      { id: 'mailbox', label: 'Development mailbox', icon: 'mail', link: '/mailbox' },
    );
  }
  return items;
}

/** The heading of the request list for a role. */
export function requestListTitle(role: Role | null): string {
  return role ? REQUESTS_LABEL[role] : 'Repair requests';
}
