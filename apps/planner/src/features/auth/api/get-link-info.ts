import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PersonTokenInfo, PersonTokenPurpose } from '@millrace/contracts';
import { api } from '@/lib/api-client';

const linkPaths: Record<PersonTokenPurpose, string> = {
  invitation: '/api/invitations',
  password_reset: '/api/password-resets',
};

/** GET /api/invitations/:token or /api/password-resets/:token (open): whose password the link sets. */
export const getLinkInfo = (purpose: PersonTokenPurpose, token: string): Promise<PersonTokenInfo> =>
  api.get<PersonTokenInfo>(`${linkPaths[purpose]}/${encodeURIComponent(token)}`);

export const linkInfoQueryOptions = (purpose: PersonTokenPurpose, token: string) =>
  queryOptions({
    queryKey: ['person-links', purpose, token],
    queryFn: () => getLinkInfo(purpose, token),
    staleTime: Infinity,
    meta: { expectUnauthenticated: true },
  });

export const useLinkInfo = (purpose: PersonTokenPurpose, token: string) => useQuery({ ...linkInfoQueryOptions(purpose, token), enabled: token !== '' });
