import { useMutation } from '@tanstack/react-query';
import type { PersonTokenPurpose, SetPasswordWithToken } from '@millrace/contracts';
import { api } from '@/lib/api-client';

const setPaths: Record<PersonTokenPurpose, string> = {
  invitation: '/api/invitations/accept',
  password_reset: '/api/password-resets/confirm',
};

/** POST /api/invitations/accept or /api/password-resets/confirm (open): the link's single use. */
export const setPasswordWithLink = (purpose: PersonTokenPurpose, body: SetPasswordWithToken): Promise<{ email: string }> =>
  api.post<{ email: string }>(setPaths[purpose], body);

export const useSetPasswordWithLink = (purpose: PersonTokenPurpose) =>
  useMutation({ mutationFn: (body: SetPasswordWithToken) => setPasswordWithLink(purpose, body), meta: { expectUnauthenticated: true } });
