import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShiftSheetsWeek } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { shiftSheetsKey } from './get-sheet-plans';

/** GET /api/plans/:id/shift-sheets?week=: one week of a plan version's sheets. */
export const getShiftSheets = (planId: number, week?: string): Promise<ShiftSheetsWeek> =>
  api.get<ShiftSheetsWeek>(`/api/plans/${planId}/shift-sheets`, { params: { week } });

export const shiftSheetsQueryOptions = (planId: number, week?: string) =>
  queryOptions({ queryKey: [...shiftSheetsKey, 'week', planId, week ?? 'first'], queryFn: () => getShiftSheets(planId, week) });

export const useShiftSheets = (planId: number | null, week?: string) =>
  useQuery({ ...shiftSheetsQueryOptions(planId ?? 0, week), enabled: planId !== null });

/** Where the PDF of a week (optionally one work center) downloads from. */
export const shiftSheetsPdfHref = (planId: number, week: string, workCenter?: string, paper: 'a4' | 'letter' = 'a4'): string => {
  const q = new URLSearchParams({ week, paper });
  if (workCenter) q.set('workCenter', workCenter);
  return `/api/plans/${planId}/shift-sheets.pdf?${q}`;
};
