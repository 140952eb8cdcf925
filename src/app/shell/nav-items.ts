import type { Capability } from '../../lib/roles';

/**
 * The main navigation, in order. An entry without `capability` is for every
 * role. Add a screen here when it exists (Fleet, Bookings, Checks, Incidents,
 * Calibration, Rentals come with their features).
 */
export interface NavItem {
  to: string;
  label: string;
  capability?: Capability;
  /** Match the path exactly (for "/"). */
  end?: boolean;
}

export const navItems: readonly NavItem[] = [
  { to: '/', label: 'Home', end: true },
  { to: '/users', label: 'Users', capability: 'users.manage' },
  { to: '/mailbox', label: 'Mailbox', capability: 'mailbox.read' },
  { to: '/admin/jobs', label: 'Scheduled jobs', capability: 'jobs.run' },
  { to: '/account/password', label: 'My password' },
];
