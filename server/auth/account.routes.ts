import { Router } from 'express';
import { acceptInvitationPayload, confirmSecondStepPayload, inviteUserPayload, linkTokenPayload, turnOffSecondStepPayload } from '../../shared/schemas/users';
import { endpoint, paging } from '../http/endpoint';
import { clearSessionCookies, setSessionCookies } from './session-cookies';
import type { AccountLinksService } from './account-links.service';
import type { AuthService } from './auth.service';
import type { SecondStep } from './second-step';

/** "My account" (sessions, second step), the owner's invitations and a colleague's second step; mounted at `/api`. */
export function accountRoutes(auth: AuthService, secondStep: SecondStep, links: AccountLinksService, opts: { secureCookies: boolean }): Router {
  const router = Router();
  const at = '/api';

  endpoint(router, at, { method: 'get', path: '/account/sessions', summary: 'Where you are signed in', access: 'account' }, async ({ actor }) => ({
    items: await auth.sessions(actor),
  }));
  endpoint(
    router,
    at,
    { method: 'delete', path: '/account/sessions/:id', summary: 'End one of your sessions', access: 'account' },
    async ({ actor, params }) => {
      await auth.endSession(actor, params.id);
      return undefined;
    },
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/account/sign-out-everywhere', summary: 'End every session and token of yours, this one too', access: 'account' },
    async ({ actor, res }) => {
      await auth.signOutEverywhere(actor);
      clearSessionCookies(res);
      return undefined;
    },
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/account/second-step/start', summary: 'Start the second step: a new secret and its QR code', access: 'account' },
    ({ actor }) => secondStep.start(actor),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/account/second-step/confirm',
      summary: 'Confirm the second step with a code; answers ten recovery codes',
      access: 'account',
      body: confirmSecondStepPayload,
    },
    ({ actor, body }) => secondStep.confirm(actor, body.code),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/account/second-step/off',
      summary: 'Turn your second step off (needs your password)',
      access: 'signed-in',
      body: turnOffSecondStepPayload,
    },
    async ({ actor, body }) => {
      await secondStep.turnOff(actor, body.password);
      return undefined;
    },
  );
  endpoint(
    router,
    at,
    { method: 'delete', path: '/users/:id/second-step', summary: "Clear a colleague's second step (a lost phone); audited", access: 'users.manage' },
    ({ actor, params }) => secondStep.clearFor(actor, params.id),
  );

  endpoint(
    router,
    at,
    { method: 'get', path: '/invitations', summary: 'Invitations not yet accepted', access: 'users.manage', query: paging },
    ({ actor, query }) => links.invitations(actor, query),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/invitations', summary: 'Invite someone by e-mail and role', access: 'users.manage', body: inviteUserPayload, status: 201 },
    ({ actor, body }) => links.invite(actor, body.email, body.role),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/invitations/:id/resend', summary: 'Mail an invitation again with a fresh link', access: 'users.manage' },
    ({ actor, params }) => links.resend(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/invitations/:id/withdraw', summary: 'Withdraw an invitation; its link stops working', access: 'users.manage' },
    async ({ actor, params }) => {
      await links.withdraw(actor, params.id);
      return undefined;
    },
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/invitations/lookup',
      summary: 'What an invitation link opens (410 when expired, used or withdrawn)',
      access: 'public',
      body: linkTokenPayload,
    },
    ({ body }) => links.invitationByToken(body.token),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/invitations/accept',
      summary: 'Accept an invitation with your name and password; signs you in',
      access: 'public',
      body: acceptInvitationPayload,
      status: 201,
    },
    async ({ body, req, res }) => {
      const session = await links.accept(body.token, body.name, body.password, req.get('user-agent'));
      setSessionCookies(res, session.token, opts.secureCookies);
      return session;
    },
  );
  return router;
}
