import { expect } from 'vitest';
import { runProgressSchema, type RunProgress } from '@millrace/contracts';
import type { TestAgent } from './test-app';

/** Polls a run until it has ended (finished, failed or cancelled). */
export async function waitForRun(agent: TestAgent, planId: number, runId: number, timeoutMs = 60_000): Promise<RunProgress> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/plans/${planId}/runs/${runId}`);
    expect(res.status).toBe(200);
    const run = runProgressSchema.parse(res.body);
    if (run.state !== 'queued' && run.state !== 'running') return run;
    if (Date.now() > until) throw new Error(`run ${runId} still ${run.state} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
