import { ROLES } from '@cc/shared';
import { navItemsFor } from './nav-items';

describe('navItemsFor', () => {
  it('offers a new request only to agents and administrators', () => {
    const withNew = ROLES.filter((role) => navItemsFor(role).some((item) => item.link === '/requests/new'));
    expect(withNew).toEqual(['agent', 'admin']);
  });

  it('offers people and organisations only to administrators', () => {
    const withAdmin = ROLES.filter((role) => navItemsFor(role).some((item) => item.link === '/admin'));
    expect(withAdmin).toEqual(['admin']);
  });

  it('gives contractors their job queue of requests to price, their day plan, their rate book and their day economics, and no one else', () => {
    expect(navItemsFor('contractor').map((item) => [item.id, item.label, item.link])).toEqual([
      ['requests', 'Assigned requests', '/requests'],
      ['dashboard', 'Dashboard', '/dashboard'],
      ['job-queue', 'Job queue', '/pricing'],
      ['day-plan', 'Day plan', '/day-plan'],
      ['rate-book', 'Rate book', '/rate-book'],
      ['economics', 'Day economics', '/economics'],
    ]);
    const withRateBook = ROLES.filter((role) => navItemsFor(role).some((item) => ['/rate-book', '/pricing', '/day-plan', '/economics'].includes(item.link)));
    expect(withRateBook).toEqual(['contractor']);
  });

  it('names the request list after what the role does with it', () => {
    expect(navItemsFor('contractor')[0]).toMatchObject({ link: '/requests', label: 'Assigned requests' });
    expect(navItemsFor('seller')[0].label).toBe('Repairs for my sale');
    expect(navItemsFor('inspector')[0].label).toBe('Inspections');
  });

  it('gives a dashboard to agents, contractors and administrators, and the development mailbox to administrators', () => {
    expect(ROLES.filter((role) => navItemsFor(role).some((item) => item.link === '/dashboard'))).toEqual(['agent', 'contractor', 'admin']);
    expect(ROLES.filter((role) => navItemsFor(role).some((item) => item.link === '/mailbox'))).toEqual(['admin']);
  });
});
