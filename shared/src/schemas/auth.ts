import { z } from 'zod';
import { emailSchema } from './common';

import { ROLES } from '../roles';

export { ROLES, STAFF_ROLES, type Role } from '../roles';
export const roleSchema = z.enum(ROLES);

/** Passwords: at least 10 characters, at most 64 (long passphrases welcome). */
export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(64, 'Use at most 64 characters');

export const loginBodySchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Required').max(256),
});
export type LoginBody = z.infer<typeof loginBodySchema>;

export const sessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  accountId: z.number().int().nullable(),
  branchIds: z.array(z.number().int()),
  isAccountOwner: z.boolean(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const meResponseSchema = z.object({ user: sessionUserSchema });
export type MeResponse = z.infer<typeof meResponseSchema>;

export const passwordChangeBodySchema = z
  .object({
    current: z.string().min(1, 'Required').max(256),
    next: passwordSchema,
  })
  .refine((v) => v.current !== v.next, {
    path: ['next'],
    message: 'Choose a password different from the current one',
  });
export type PasswordChangeBody = z.infer<typeof passwordChangeBodySchema>;

export const csrfResponseSchema = z.object({ token: z.string() });
