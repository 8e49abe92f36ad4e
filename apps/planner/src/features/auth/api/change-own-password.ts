import { useMutation } from '@tanstack/react-query';
import { passwordChangeSchema, type PasswordChange } from '@millrace/contracts';
import { api } from '@/lib/api-client';

export { passwordChangeSchema };

/** PUT /api/me/password (every role): the current password, then the new one. */
export const changeOwnPassword = (body: PasswordChange): Promise<void> => api.put<void>('/api/me/password', body);

export const useChangeOwnPassword = () => useMutation({ mutationFn: changeOwnPassword });
