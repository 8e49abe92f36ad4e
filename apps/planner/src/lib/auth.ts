import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Me, SessionState, SignIn } from '@millrace/contracts';
import { api, ApiError } from './api-client';

/**
 * The signed-in person, from the open GET /api/session (which answers 200 either way, so asking
 * before anyone has signed in leaves no failed request in the browser). Signed out, it fails
 * like GET /api/me would, with a 401 ApiError, which the loaders turn into the sign-in page.
 * Shared by the shell and every feature that mirrors roles.
 */
export const getMe = async (): Promise<Me> => {
  const session = await api.get<SessionState>('/api/session');
  if (!session.signedIn) throw new ApiError({ status: 401, code: 'unauthenticated', message: 'Sign in to continue.' });
  return session.person;
};

export const meQueryOptions = () =>
  queryOptions({
    queryKey: ['me'],
    queryFn: getMe,
    staleTime: 5 * 60_000,
    // The shell's loader handles a 401 itself by redirecting to sign-in.
    meta: { expectUnauthenticated: true },
  });

export const useMe = () => useQuery(meQueryOptions());

export const signIn = (body: SignIn): Promise<Me> => api.post<Me>('/api/auth/sign-in', body);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    meta: { expectUnauthenticated: true },
    onSuccess: async (me) => {
      queryClient.clear();
      // The sign-in answer may be empty on some servers; ask /api/me when it is.
      if (me && typeof me === 'object' && 'role' in me) queryClient.setQueryData(meQueryOptions().queryKey, me);
      else await queryClient.fetchQuery(meQueryOptions());
    },
  });
}

export const signOut = (): Promise<void> => api.post<void>('/api/auth/sign-out');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    meta: { expectUnauthenticated: true },
    onSettled: () => queryClient.clear(),
  });
}
