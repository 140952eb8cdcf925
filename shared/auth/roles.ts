/** The four roles of DESIGN.md §2 and what each may do. The server enforces
 * this table; the client reads the same table to hide what a role may not do. */
export const roles = ['owner', 'manager', 'technician', 'billing'] as const;
export type Role = (typeof roles)[number];

export const capabilities = [
  'users.manage',
  'settings.manage',
  'mailbox.read',
  'routines.run',
  'fleet.read',
  'fleet.write',
  'calibration.record',
  'bookings.read',
  'bookings.write',
  'bookings.hand_over',
  'checks.record',
  'incidents.report',
  'incidents.review',
  'holds.release',
  'impact.review',
  'customers.read',
  'customers.write',
  'rentals.write',
  'deposits.manage',
  'reports.read',
  'audit.pack',
] as const;
export type Capability = (typeof capabilities)[number];

const everyCapability: readonly Capability[] = capabilities;

export const capabilitiesByRole: Record<Role, readonly Capability[]> = {
  owner: everyCapability,
  manager: [
    'fleet.read',
    'fleet.write',
    'calibration.record',
    'bookings.read',
    'bookings.write',
    'bookings.hand_over',
    'checks.record',
    'incidents.report',
    'incidents.review',
    'holds.release',
    // Bookings for a rental name its customer.
    'customers.read',
  ],
  technician: ['fleet.read', 'bookings.read', 'checks.record', 'incidents.report'],
  billing: ['fleet.read', 'bookings.read', 'customers.read', 'customers.write', 'rentals.write', 'deposits.manage', 'reports.read'],
};

export function can(role: Role, capability: Capability): boolean {
  return capabilitiesByRole[role].includes(capability);
}

export const roleTitles: Record<Role, string> = {
  owner: 'Owner',
  manager: 'Shop manager',
  technician: 'Field technician',
  billing: 'Billing clerk',
};

/** The roles that move money: a firm can require them to sign in with a second step. */
export const secondStepRoles: readonly Role[] = ['owner', 'billing'];
