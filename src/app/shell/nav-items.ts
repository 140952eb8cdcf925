import type { Capability } from '../../lib/roles';

/**
 * The main navigation, in order. An entry without `capability` is for every
 * role. Add a screen here when it exists. Field checks start from an
 * asset: no entry; customers, rates and billing reports open from Rentals and Invoices.
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
  { to: '/board', label: 'Bookings', capability: 'bookings.read' },
  { to: '/jobs', label: 'Jobs', capability: 'bookings.read' },
  { to: '/fleet', label: 'Fleet', capability: 'fleet.read' },
  { to: '/kits', label: 'Kits', capability: 'fleet.read' },
  { to: '/calibration', label: 'Calibration', capability: 'reports.read' },
  { to: '/audit-pack', label: 'Audit pack', capability: 'audit.pack' },
  { to: '/rentals', label: 'Rentals', capability: 'reports.read' },
  { to: '/invoices', label: 'Invoices', capability: 'reports.read' },
  { to: '/scan', label: 'Find by label', capability: 'fleet.read' },
  { to: '/incidents', label: 'Incidents', capability: 'fleet.read' },
  { to: '/outbox', label: 'On this phone', capability: 'checks.record' },
  { to: '/users', label: 'Users', capability: 'users.manage' },
  { to: '/mailbox', label: 'Mailbox', capability: 'mailbox.read' },
  { to: '/admin/routines', label: 'Routines', capability: 'routines.run' },
  { to: '/settings', label: 'Settings', capability: 'settings.manage' },
  { to: '/account', label: 'My account' },
];
