import { useMutation } from '@tanstack/react-query';
import { passwordResetRequestSchema, type PasswordResetRequest } from '@millrace/contracts';
import { api } from '@/lib/api-client';

export { passwordResetRequestSchema };

/** POST /api/password-resets/request (open): always 202, whether or not the address is known. */
export const requestPasswordReset = (body: PasswordResetRequest): Promise<{ message: string }> =>
  api.post<{ message: string }>('/api/password-resets/request', body);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset, meta: { expectUnauthenticated: true } });
