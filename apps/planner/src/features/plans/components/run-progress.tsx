import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import type { RunProgress } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { formatNumber } from '@/lib/format';
import { useCancelRun } from '../api/cancel-run';
import { plansKey } from '../api/get-plans';
import { isLiveRun, useRunProgress } from '../api/get-run-progress';
import { formatTiny, runStateWords } from '../plan-words';

/**
 * The relative duality gap the solver stops at (lp-core settings `tolGapRel`, 1e-8). The bar
 * measures progress as orders of magnitude of gap closed from 1 down to it: interior-point
 * methods close the gap roughly geometrically, so this moves steadily (common practice, no source).
 */
export const targetGap = 1e-8;

/** Percent shown for a run: 100 once finished, measured from the gap while running. */
export function runPercent(run: RunProgress): number | null {
  if (run.state === 'finished') return 100;
  if (run.state === 'queued') return 0;
  if (run.relativeGap === null || !Number.isFinite(run.relativeGap)) return run.state === 'running' ? null : 0;
  const closed = -Math.log10(Math.max(run.relativeGap, targetGap)) / -Math.log10(targetGap);
  return Math.round(Math.min(99, Math.max(0, closed * 100)));
}

function describe(run: RunProgress): string {
  const parts = [`Iteration ${run.iteration}`, `gap ${formatTiny(run.relativeGap)}`, `${formatNumber(run.elapsedSeconds)} s elapsed`];
  return parts.join(' · ');
}

/** The live progress of a solve run: bar, iteration, gap, elapsed time; cancel while it runs. */
export function RunProgressPanel({ planId, runId, canCancel }: { planId: number; runId: number; canCancel: boolean }) {
  const run = useRunProgress(planId, runId);
  const cancel = useCancelRun();
  const queryClient = useQueryClient();
  const wasLive = useRef<boolean | null>(null);

  // When a run ends, the plan's status, certificate and results have changed: read them again.
  const live = isLiveRun(run.data);
  useEffect(() => {
    if (run.data === undefined) return;
    if (wasLive.current === true && !live) void queryClient.invalidateQueries({ queryKey: plansKey });
    wasLive.current = live;
  }, [live, run.data, queryClient]);

  if (run.isPending) {
    return (
      <div role="status" className="text-ink-soft">
        Reading the solve run…
      </div>
    );
  }
  if (run.isError) return <ErrorState error={run.error} onRetry={() => void run.refetch()} />;

  const r = run.data;
  const percent = runPercent(r);
  const state = r.cancelRequested && live ? 'Cancelling…' : runStateWords[r.state];
  const valueText = `${state}${percent === null ? '' : `, ${percent} %`}. ${describe(r)}`;

  return (
    <section aria-label={`Solve run ${r.runId}`} className="flex flex-col gap-2 rounded border border-line bg-panel p-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="font-semibold">
          Run {r.runId}: {state}
          {percent !== null ? ` — ${percent} %` : ''}
        </p>
        {canCancel && live ? (
          <Button
            size="sm"
            variant="danger"
            busy={cancel.isPending}
            busyLabel="Cancelling…"
            disabled={r.cancelRequested}
            onClick={() => cancel.mutate({ planId, runId })}
          >
            Cancel solve
          </Button>
        ) : null}
      </div>
      <div
        role="progressbar"
        aria-label="Solve progress"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        aria-valuetext={valueText}
        className="h-4 w-full overflow-hidden rounded border border-line bg-paper"
      >
        <div
          className={`h-full ${r.state === 'failed' || r.state === 'cancelled' ? 'bg-over-200' : 'bg-race-600'} ${percent === null ? 'w-1/3 animate-pulse' : ''}`}
          style={percent === null ? undefined : { width: `${percent}%` }}
        />
      </div>
      <p className="text-sm tabular-nums" aria-live="polite">
        {describe(r)}
      </p>
      {r.message ? <p className="text-sm text-ink-soft">{r.message}</p> : null}
      {cancel.isError ? <ErrorState error={cancel.error} /> : null}
    </section>
  );
}
