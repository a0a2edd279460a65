import { z } from 'zod';
import { roleSchema } from './roles.ts';

// The sign-in, password reset and people forms' input schemas, checked by the API and by the forms.
// Apart from auth.ts (the records), which every page loads at start-up.

const emailSchema = z
  .string({ error: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter an e-mail address')
  .max(254, 'That e-mail address is too long')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com' }));

/** Password policy: long rather than complicated (12 to 200 characters). */
export const newPasswordSchema = z
  .string({ error: 'Enter a password' })
  .min(12, 'Use at least 12 characters')
  .max(200, 'Use at most 200 characters');

export const loginInputSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(200, 'Password too long'),
});
export type LoginInput = z.infer<typeof loginInputSchema>;

export const resetRequestInputSchema = z.object({ email: emailSchema });
export type ResetRequestInput = z.infer<typeof resetRequestInputSchema>;

export const resetInputSchema = z.object({
  token: z.string({ error: 'The link is missing its token' }).min(20, 'The link is incomplete').max(200),
  password: newPasswordSchema,
});
export type ResetInput = z.infer<typeof resetInputSchema>;

export const inviteUserInputSchema = z.object({
  email: emailSchema,
  name: z.string({ error: 'Enter a name' }).trim().min(1, 'Enter a name').max(120, 'Use at most 120 characters'),
  role: roleSchema,
});
export type InviteUserInput = z.infer<typeof inviteUserInputSchema>;

export const updateUserInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120, 'Use at most 120 characters').optional(),
    role: roleSchema.optional(),
    isActive: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateUserInput = z.infer<typeof updateUserInputSchema>;

export const userListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  role: roleSchema.optional(),
  status: z.enum(['active', 'inactive', 'all']).default('all'),
  sort: z.enum(['name', '-name', 'email', '-email', 'role', '-role', 'createdAt', '-createdAt']).default('name'),
});
