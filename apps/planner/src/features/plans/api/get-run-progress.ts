import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RunProgress, RunState } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** How often a live run is read while it is queued or running (common practice, no source). */
export const runPollIntervalMs = 700;

/** Run states in which the run may still change. */
export const liveRunStates: readonly RunState[] = ['queued', 'running'];

export const isLiveRun = (run: RunProgress | undefined) => run !== undefined && liveRunStates.includes(run.state);

/** GET /api/plans/:id/runs/:runId: iteration, gap and elapsed time of a solve. */
export const getRunProgress = (planId: number, runId: number): Promise<RunProgress> =>
  api.get<RunProgress>(`/api/plans/${planId}/runs/${runId}`);

export const runProgressQueryOptions = (planId: number, runId: number) =>
  queryOptions({
    queryKey: [...plansKey, 'run', planId, runId],
    queryFn: () => getRunProgress(planId, runId),
    staleTime: 0,
    // Poll while the run may still change; stop once it has ended.
    refetchInterval: (query) => (query.state.data === undefined || isLiveRun(query.state.data) ? runPollIntervalMs : false),
  });

export const useRunProgress = (planId: number, runId: number | null) =>
  useQuery({ ...runProgressQueryOptions(planId, runId ?? 0), enabled: runId !== null });
