import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationCreateSchema, type InvitationCreate, type InvitationSent } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { peopleQueryOptions } from './get-people';

export { invitationCreateSchema };

/** POST /api/invitations (admin): the person gets an e-mail with a single-use link to choose a password. */
export const invitePerson = (body: InvitationCreate): Promise<InvitationSent> => api.post<InvitationSent>('/api/invitations', body);

export function useInvitePerson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: invitePerson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}
