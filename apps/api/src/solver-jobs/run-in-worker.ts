import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { ComputeProgress } from './compute-plan';
import type { WorkerInput, WorkerMessage, WorkerTask } from './worker-protocol';

/** How long a worker gets to stop by itself after the stop flag is set before it is terminated (ms). */
const stopGraceMs = 5_000;

/**
 * The worker's first lines: register tsx's ESM loader in the new thread, then load the TypeScript
 * entry. (`execArgv: ['--import', 'tsx']` is not applied to worker threads on Node 20.) tsx's ESM
 * API is located from its package.json, so the thread does not depend on the working directory.
 */
function bootstrapSource(entry: URL): string {
  const require = createRequire(import.meta.url);
  const tsxDir = dirname(require.resolve('tsx/package.json'));
  const pkg = JSON.parse(readFileSync(join(tsxDir, 'package.json'), 'utf8')) as { exports: Record<string, { import: { default: string } }> };
  const api = pathToFileURL(join(tsxDir, pkg.exports['./esm/api'].import.default)).href;
  return `import(${JSON.stringify(api)}).then((tsx) => { tsx.register(); return import(${JSON.stringify(entry.href)}); });`;
}

const workerEntry = new URL('./solve-worker.ts', import.meta.url);
let bootstrap: string | undefined;

export type WorkerReply = Exclude<WorkerMessage, { type: 'progress' }>;

export interface RunningWorker {
  /** the final message (solved, cross_checked or error); rejects only if the thread dies */
  done: Promise<WorkerReply>;
  /** asks the solver to stop at its next iteration; terminates the thread if it does not */
  stop(): void;
}

/**
 * Runs a solver task in a worker thread (never on the request thread), TypeScript loaded by tsx
 * in the thread as in the API itself.
 */
export function runInWorker(task: WorkerTask, onProgress: (p: ComputeProgress) => void): RunningWorker {
  const stopFlag = new SharedArrayBuffer(4);
  const input: WorkerInput = { task, stopFlag };
  bootstrap ??= bootstrapSource(workerEntry);
  const worker = new Worker(bootstrap, { eval: true, workerData: input });
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
