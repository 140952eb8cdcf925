import { Router } from 'express';
import { z } from 'zod';
import { roles } from '../../shared/auth/roles';
import { createUserPayload, resetPasswordPayload, updateUserPayload } from '../../shared/schemas/users';
import { endpoint, paging } from '../http/endpoint';
import type { UsersService } from './users.service';

export function usersRoutes(users: UsersService): Router {
  const router = Router();
  const at = '/api/users';
  endpoint(router, at, { method: 'get', path: '/', summary: "List the firm's users", access: 'users.manage', query: paging }, ({ actor, query }) =>
    users.list(actor, query),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/staff',
      summary: "The firm's active people by name and role (lead technician, taken by)",
      access: 'bookings.read',
      query: z.object({
        role: z
          .preprocess(
            (v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v),
            z.array(z.enum(roles, { message: `must be one of ${roles.join(', ')}` })),
          )
          .default([...roles]),
      }),
    },
    ({ actor, query }) => users.staff(actor, query.role),
  );
  endpoint(router, at, { method: 'post', path: '/', summary: 'Add a user', access: 'users.manage', body: createUserPayload, status: 201 }, ({ actor, body }) =>
    users.create(actor, body),
  );
  endpoint(
    router,
    at,
    { method: 'patch', path: '/:id', summary: "Change a user's name, role or disable them", access: 'users.manage', body: updateUserPayload },
    ({ actor, params, body }) => users.update(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/:id/password', summary: "Set a user's password", access: 'users.manage', body: resetPasswordPayload },
    ({ actor, params, body }) => users.resetPassword(actor, params.id, body.password),
  );
  return router;
}
