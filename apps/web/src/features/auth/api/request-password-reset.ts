import type { ResetRequestInput } from '@stringfield/shared';
import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';

const messageResponseSchema = z.object({ message: z.string() });

/** Asks for a reset e-mail. The answer is the same whether or not the address has an account. */
export async function requestPasswordReset(input: ResetRequestInput): Promise<string> {
  const { message } = await api.post('/api/auth/reset-request', input, messageResponseSchema);
  return message;
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
