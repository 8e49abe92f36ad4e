import { useQueries } from '@tanstack/react-query';
import type { PlanSummary } from '@millrace/contracts';
import { planQueryOptions } from '../api/get-plan';
import type { PlanRow } from './plans-columns';

/** Most plan details read for the list's certificate column (newest first); older rows say "—". */
const maxDetailsRead = 40;

/**
 * The list answer carries no certificate nor whole-units margin, so the list reads each solved
 * version's detail (shared with the plan page's cache).
 */
export function usePlanRows(plans: PlanSummary[]): PlanRow[] {
  const solved = plans.filter((p) => p.solveStatus === 'solved').slice(0, maxDetailsRead);
  const details = useQueries({ queries: solved.map((p) => ({ ...planQueryOptions(p.id), staleTime: 60_000 })) });
  const byId = new Map(solved.map((p, i) => [p.id, details[i]]));
  return plans.map((p) => {
    const d = byId.get(p.id);
    if (!d) return { ...p, certificate: 'none', rounding: null };
    if (d.isPending) return { ...p, certificate: 'loading', rounding: null };
    if (d.isError) return { ...p, certificate: 'unknown', rounding: null };
    return { ...p, certificate: d.data.certificate?.crossCheck?.status ?? 'none', rounding: d.data.rounding };
  });
}
