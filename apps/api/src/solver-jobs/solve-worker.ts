/**
 * Entry of a solver worker thread (started by run-in-worker.ts with `--import tsx`). It runs one
 * task off the request thread: a plan solve, reporting progress at most every
 * `progressIntervalMs`, or a cross-check. The stop flag is shared memory, read between
 * iterations, because the thread's event loop is busy while it solves.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { WorkerInput, WorkerMessage } from './worker-protocol';

const progressIntervalMs = 100;

async function main(): Promise<void> {
  const { task, stopFlag } = workerData as WorkerInput;
  const stop = new Int32Array(stopFlag);
  const post = (m: WorkerMessage) => parentPort!.postMessage(m);
  try {
    if (task.kind === 'solve') {
      // Each task loads only its own solvers.
      const { computePlan } = await import('./compute-plan');
      let lastPost = 0;
      const outcome = computePlan(task.request, {
        onProgress(progress) {
          const now = performance.now();
          if (now - lastPost < progressIntervalMs) return;
          lastPost = now;
          post({ type: 'progress', progress });
        },
        shouldStop: () => Atomics.load(stop, 0) === 1,
      });
      post({ type: 'solved', outcome });
    } else {
      const { crossCheckPlan } = await import('./cross-check-plan');
      post({ type: 'cross_checked', crossCheck: await crossCheckPlan(task.request, task.settings) });
    }
  } catch (err) {
    post({ type: 'error', message: err instanceof Error ? err.message : String(err) });
  }
}

void main();
