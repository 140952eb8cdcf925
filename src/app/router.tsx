import { createBrowserRouter, redirect, type RouteObject } from 'react-router-dom';
import type { ComponentType } from 'react';
import { RequireSession } from '../features/auth/components/require-session';
import type { Capability } from '../lib/roles';
import { AppShell } from './shell/app-shell';
import { RequireCapability } from './shell/require-capability';
import { RouteError } from './shell/route-error';
import { Splash } from './shell/splash';

/** Every screen is its own chunk; its module's default export is the screen. */
function screen(load: () => Promise<{ default: ComponentType }>): RouteObject['lazy'] {
  return { Component: async () => (await load()).default };
}

/** Screens only some roles may open (same capability as their nav entry). */
function gated(capability: Capability, children: RouteObject[]): RouteObject {
  return { element: <RequireCapability capability={capability} />, children };
}

export const routes: RouteObject[] = [
  // Reached before signing in: the sign-in page and the pages mailed links open.
  ...(
    [
      ['/sign-in', () => import('./routes/sign-in')],
      ['/forgot-password', () => import('./routes/forgot-password')],
      ['/reset-password', () => import('./routes/reset-password')],
      ['/join', () => import('./routes/join')],
    ] as const
  ).map(([path, load]) => ({ path, lazy: screen(load), errorElement: <RouteError />, hydrateFallbackElement: <Splash /> })),
  // The renter's pages: no sign-in, the secret link is the key.
  { path: '/renter/returned', lazy: screen(() => import('./routes/renter-returned')), errorElement: <RouteError />, hydrateFallbackElement: <Splash /> },
  { path: '/renter/:token', lazy: screen(() => import('./routes/renter')), errorElement: <RouteError />, hydrateFallbackElement: <Splash /> },
  {
    path: '/',
    element: (
      <RequireSession>
        <AppShell />
      </RequireSession>
    ),
    errorElement: <RouteError />,
    hydrateFallbackElement: <Splash />,
    children: [
      {
        // Errors inside a screen keep the shell (and its way out) on screen.
        errorElement: <RouteError />,
        children: [
          { index: true, lazy: screen(() => import('./routes/home')) },
          gated('fleet.read', [
            { path: 'fleet', lazy: screen(() => import('./routes/fleet')) },
            { path: 'fleet/:id', lazy: screen(() => import('./routes/asset')) },
            { path: 'fleet/:id/record', lazy: screen(() => import('./routes/asset-record')) },
            { path: 'kits', lazy: screen(() => import('./routes/kits')) },
            { path: 'kits/:id', lazy: screen(() => import('./routes/kit')) },
            { path: 'scan', lazy: screen(() => import('./routes/scan')) },
            { path: 'scan/:code', lazy: screen(() => import('./routes/scan')) },
            { path: 'checks/:id', lazy: screen(() => import('./routes/check')) },
            { path: 'incidents', lazy: screen(() => import('./routes/incidents')) },
            { path: 'incidents/:id', lazy: screen(() => import('./routes/incident')) },
            { path: 'calibration/impact/:assetId', lazy: screen(() => import('./routes/impact-review')) },
          ]),
          gated('reports.read', [
            { path: 'calibration', lazy: screen(() => import('./routes/calibration')) },
            { path: 'rentals', lazy: screen(() => import('./routes/rentals')) },
            { path: 'rentals/:id', lazy: screen(() => import('./routes/rental')) },
            { path: 'invoices', lazy: screen(() => import('./routes/invoices')) },
            { path: 'customers', lazy: screen(() => import('./routes/customers')) },
            { path: 'customers/:id', lazy: screen(() => import('./routes/customer')) },
            { path: 'billing/reports', lazy: screen(() => import('./routes/billing-reports')) },
          ]),
          gated('audit.pack', [{ path: 'audit-pack', lazy: screen(() => import('./routes/audit-pack')) }]),
          gated('rentals.write', [{ path: 'rentals/new', lazy: screen(() => import('./routes/rental-new')) }]),
          gated('calibration.record', [
            { path: 'fleet/:id/calibrate', lazy: screen(() => import('./routes/calibration-record')) },
            { path: 'calibration/plan/:assetId', lazy: screen(() => import('./routes/calibration-plan')) },
            { path: 'calibration/plan', lazy: screen(() => import('./routes/calibration-trip')) },
            { path: 'calibration/trips', lazy: screen(() => import('./routes/lab-trips')) },
          ]),
          gated('checks.record', [
            { path: 'checks/new', lazy: screen(() => import('./routes/check-new')) },
            { path: 'outbox', lazy: screen(() => import('./routes/outbox')) },
          ]),
          gated('incidents.report', [{ path: 'incidents/new', lazy: screen(() => import('./routes/incident-new')) }]),
          gated('bookings.read', [
            { path: 'board', lazy: screen(() => import('./routes/board')) },
            { path: 'bookings/:id', lazy: screen(() => import('./routes/booking')) },
            { path: 'jobs', lazy: screen(() => import('./routes/site-jobs')) },
          ]),
          gated('bookings.write', [{ path: 'bookings/new', lazy: screen(() => import('./routes/booking-new')) }]),
          gated('bookings.hand_over', [
            { path: 'bookings/:id/checkout', lazy: screen(() => import('./routes/booking-handover')) },
            { path: 'bookings/:id/return', lazy: screen(() => import('./routes/booking-handover')) },
          ]),
          gated('fleet.write', [
            { path: 'fleet/new', lazy: screen(() => import('./routes/asset-form')) },
            { path: 'fleet/:id/edit', lazy: screen(() => import('./routes/asset-form')) },
          ]),
          gated('settings.manage', [{ path: 'settings', lazy: screen(() => import('./routes/settings')) }]),
          gated('users.manage', [{ path: 'users', lazy: screen(() => import('./routes/users')) }]),
          gated('mailbox.read', [{ path: 'mailbox', lazy: screen(() => import('./routes/mailbox')) }]),
          gated('routines.run', [
            { path: 'admin/routines', lazy: screen(() => import('./routes/routines')) },
            // The screen's first address, from when routines were "scheduled jobs".
            { path: 'admin/jobs', loader: () => redirect('/admin/routines') },
          ]),
          { path: 'account', lazy: screen(() => import('./routes/account')) },
          // The page's first address, from when it held only the password change.
          { path: 'account/password', loader: () => redirect('/account') },
          { path: '*', lazy: screen(() => import('./routes/not-found')) },
        ],
      },
    ],
  },
];

export function createRouter() {
  return createBrowserRouter(routes);
}
