import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SheetPlan } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** Root of every shift-sheet query key. */
export const shiftSheetsKey = ['shift-sheets'] as const;

/** GET /api/shift-sheets/plans: plan versions whose sheets I may read, newest first (floor leads: released only). */
export const getSheetPlans = (): Promise<SheetPlan[]> => api.get<SheetPlan[]>('/api/shift-sheets/plans');

export const sheetPlansQueryOptions = () => queryOptions({ queryKey: [...shiftSheetsKey, 'plans'], queryFn: getSheetPlans });

export const useSheetPlans = () => useQuery(sheetPlansQueryOptions());
