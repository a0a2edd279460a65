import type { ResetInput } from '@stringfield/shared';
import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const messageResponseSchema = z.object({ message: z.string() });

/** Sets a new password from an e-mailed token; the same call accepts an invitation. */
export async function resetPassword(input: ResetInput): Promise<string> {
  const { message } = await api.post('/api/auth/reset', input, messageResponseSchema);
  return message;
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
