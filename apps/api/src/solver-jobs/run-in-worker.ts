import { Worker } from 'node:worker_threads';
import type { ComputeProgress } from './compute-plan';
import type { WorkerInput, WorkerMessage, WorkerTask } from './worker-protocol';

/** How long a worker gets to stop by itself after the stop flag is set before it is terminated (ms). */
const stopGraceMs = 5_000;

export type WorkerReply = Exclude<WorkerMessage, { type: 'progress' }>;

export interface RunningWorker {
  /** the final message (solved, cross_checked or error); rejects only if the thread dies */
  done: Promise<WorkerReply>;
  /** asks the solver to stop at its next iteration; terminates the thread if it does not */
  stop(): void;
}

/**
 * Runs a solver task in a worker thread (never on the request thread). TypeScript is loaded in
 * the thread by `--import tsx`, the same way the API itself runs.
 */
export function runInWorker(task: WorkerTask, onProgress: (p: ComputeProgress) => void): RunningWorker {
  const stopFlag = new SharedArrayBuffer(4);
  const input: WorkerInput = { task, stopFlag };
  const worker = new Worker(new URL('./solve-worker.ts', import.meta.url), { workerData: input, execArgv: ['--import', 'tsx'] });
  let reply: WorkerReply | null = null;
  let killTimer: NodeJS.Timeout | null = null;
  const done = new Promise<WorkerReply>((resolve, reject) => {
    worker.on('message', (m: WorkerMessage) => {
      if (m.type === 'progress') return onProgress(m.progress);
      reply = m;
      resolve(m);
      void worker.terminate();
    });
    worker.on('error', reject);
    worker.on('exit', (code) => {
      if (killTimer) clearTimeout(killTimer);
      if (reply) resolve(reply);
      else if (Atomics.load(new Int32Array(stopFlag), 0) === 1) resolve({ type: 'solved', outcome: { kind: 'cancelled', seconds: 0 } });
      else reject(new Error(`The solver thread stopped (exit code ${code}) without an answer.`));
    });
  });
  return {
    done,
    stop() {
      Atomics.store(new Int32Array(stopFlag), 0, 1);
      killTimer ??= setTimeout(() => void worker.terminate(), stopGraceMs);
    },
  };
}
