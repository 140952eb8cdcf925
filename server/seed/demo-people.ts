import type { Role } from '../../shared/auth/roles';

/** The invented demo firms. Every name here is made up. */
export const DEMO_PASSWORD = 'nestkeeper-demo';

export const demoFirm = {
  name: 'Brackenmoor Dimensional Works',
  town: 'Wrenhallow',
  timeZone: 'Europe/Berlin',
  currency: 'EUR',
  people: [
    { email: 'owner@demo.test', name: 'Maren Holloway', role: 'owner' },
    { email: 'manager@demo.test', name: 'Idris Penvale', role: 'manager' },
    { email: 'tech@demo.test', name: 'Tamsin Quillfeather', role: 'technician' },
    { email: 'billing@demo.test', name: 'Oskar Brandlin', role: 'billing' },
  ] satisfies { email: string; name: string; role: Role }[],
};

export const otherFirm = {
  name: 'Pellbrook Gauge & Survey',
  town: 'Pellbrook',
  timeZone: 'Europe/London',
  currency: 'GBP',
  people: [{ email: 'owner@other.test', name: 'Ludo Ashcombe', role: 'owner' }] satisfies { email: string; name: string; role: Role }[],
};
