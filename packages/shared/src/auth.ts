import { z } from 'zod';
import { roleSchema } from './roles.ts';

// Who is signed in and the users as the API sends them. The sign-in, reset and people forms' input
// schemas (with their messages) are in auth-inputs.ts, so every page's start-up does not build them.

/** A user as the API hands it out (never the password hash). */
export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  isActive: z.boolean(),
  hasPassword: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const sessionUserSchema = userSchema.pick({ id: true, email: true, name: true, role: true });
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const meResponseSchema = z.object({ user: sessionUserSchema });
export const csrfResponseSchema = z.object({ csrfToken: z.string() });
