import { z } from 'zod';
import { roles } from '../auth/roles';
import { emailAddress } from './common';

export const MIN_PASSWORD_LENGTH = 10;

const email = emailAddress;
const password = z.string().min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`).max(200, 'is too long');

export const loginPayload = z.object({ email, password: z.string().min(1, 'is required').max(200) });

export const changeOwnPasswordPayload = z.object({ currentPassword: z.string().min(1, 'is required'), newPassword: password });

export const createUserPayload = z.object({
  email,
  name: z.string().trim().min(1, 'is required').max(120),
  role: z.enum(roles, { message: `must be one of ${roles.join(', ')}` }),
  password,
});

export const updateUserPayload = z
  .object({
    name: z.string().trim().min(1, 'is required').max(120).optional(),
    role: z.enum(roles, { message: `must be one of ${roles.join(', ')}` }).optional(),
    disabled: z.boolean().optional(),
  })
  .strict();

export const resetPasswordPayload = z.object({ password });
