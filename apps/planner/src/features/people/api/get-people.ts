import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Person } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/people (admin): everyone who can sign in, and who could. */
export const getPeople = (): Promise<Person[]> => api.get<Person[]>('/api/people');

export const peopleQueryOptions = () => queryOptions({ queryKey: ['people', 'list'], queryFn: getPeople });

export const usePeople = () => useQuery(peopleQueryOptions());
