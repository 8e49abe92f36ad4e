import { useMutation, useQueryClient } from '@tanstack/react-query';
import { calendarReplaceSchema, type CalendarReplace } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { workCenterQueryOptions } from './get-work-center';

export { calendarReplaceSchema };
export type { CalendarReplace };

/** PUT /api/work-centers/:id/calendar: the whole list of exceptional weeks. */
export const replaceCalendar = ({ id, body }: { id: number; body: CalendarReplace }): Promise<unknown> =>
  api.put<unknown>(`/api/work-centers/${id}/calendar`, body);

export function useReplaceCalendar() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: replaceCalendar,
    onSuccess: (_r, { id }) => queryClient.invalidateQueries({ queryKey: workCenterQueryOptions(id).queryKey }),
  });
}
