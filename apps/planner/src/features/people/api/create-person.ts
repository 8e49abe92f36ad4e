import { useMutation, useQueryClient } from '@tanstack/react-query';
import { personCreateSchema, type Person, type PersonCreate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { peopleQueryOptions } from './get-people';

export { personCreateSchema };
export type { PersonCreate };

/** POST /api/people (admin). */
export const createPerson = (body: PersonCreate): Promise<Person> => api.post<Person>('/api/people', body);

export function useCreatePerson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPerson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}
