/**
 * Entry of a solver worker thread (started by solver-thread.ts). The thread stays up and runs
 * one task at a time off the request thread: a plan solve, reporting progress at most every
 * `progressIntervalMs`, or a cross-check. The stop flag is shared memory, read between
 * iterations, because the thread's event loop is busy while it solves.
 */
import { parentPort } from 'node:worker_threads';
import type { WorkerMessage, WorkerTaskMessage, WorkerWarmMessage } from './worker-protocol';

const progressIntervalMs = 100;

async function run({ taskId, task, stopFlag }: WorkerTaskMessage): Promise<void> {
  const stop = new Int32Array(stopFlag);
  const post = (m: WorkerMessage) => parentPort!.postMessage(m);
  try {
    if (task.kind === 'solve') {
      // Each task loads only its own solvers (once per thread).
      const { computePlan } = await import('./compute-plan');
      let lastPost = 0;
      const outcome = computePlan(task.request, {
        onProgress(progress) {
          const now = performance.now();
          if (now - lastPost < progressIntervalMs) return;
          lastPost = now;
          post({ taskId, type: 'progress', progress });
        },
        shouldStop: () => Atomics.load(stop, 0) === 1,
      });
      post({ taskId, type: 'solved', outcome });
    } else {
      const { crossCheckPlan } = await import('./cross-check-plan');
      post({ taskId, type: 'cross_checked', crossCheck: await crossCheckPlan(task.request, task.settings) });
    }
  } catch (err) {
    post({ taskId, type: 'error', message: err instanceof Error ? err.message : String(err) });
  }
}

async function warm({ warm: kind }: WorkerWarmMessage): Promise<void> {
  await (kind === 'solve' ? import('./compute-plan') : import('./cross-check-plan'));
}

let queue = Promise.resolve();
parentPort!.on('message', (m: WorkerTaskMessage | WorkerWarmMessage) => {
  queue = queue.then(() => ('warm' in m ? warm(m) : run(m))).catch(() => {});
});
