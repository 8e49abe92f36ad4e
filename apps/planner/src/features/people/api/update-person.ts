import { useMutation, useQueryClient } from '@tanstack/react-query';
import { personUpdateSchema, type Person, type PersonUpdate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { peopleQueryOptions } from './get-people';

export { personUpdateSchema };
export type { PersonUpdate };

/** PATCH /api/people/:id (admin): role, active or name, with the version read. */
export const updatePerson = ({ id, body }: { id: number; body: PersonUpdate }): Promise<Person> =>
  api.patch<Person>(`/api/people/${id}`, personUpdateSchema.parse(body));

export function useUpdatePerson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePerson,
    onSettled: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}
