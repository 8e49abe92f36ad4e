import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { ComputeProgress } from './compute-plan';
import type { WorkerMessage, WorkerTask, WorkerTaskMessage, WorkerWarmMessage } from './worker-protocol';

/** How long a task gets to stop by itself after its stop flag is set before the thread is terminated (ms). */
const stopGraceMs = 5_000;

export type WorkerReply = Exclude<WorkerMessage, { type: 'progress' }>;

export interface RunningTask {
  /** the final message (solved, cross_checked or error); rejects only if the thread dies */
  done: Promise<WorkerReply>;
  /** asks the task to stop at its next iteration; terminates the thread if it does not */
  stop(): void;
}

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

/**
 * One long-lived solver thread (never the request thread): tasks run one after another in it,
 * so TypeScript and the solvers are loaded once, not per solve. A thread that dies or has to be
 * terminated is replaced on the next task.
 */
export class SolverThread {
  private worker: Worker | null = null;
  private nextTaskId = 1;
  private readonly pending = new Map<number, { resolve: (r: WorkerReply) => void; reject: (e: Error) => void; onProgress: (p: ComputeProgress) => void }>();

  run(task: WorkerTask, onProgress: (p: ComputeProgress) => void): RunningTask {
    const worker = this.ensureWorker();
    const taskId = this.nextTaskId++;
    const stopFlag = new SharedArrayBuffer(4);
    const done = new Promise<WorkerReply>((resolve, reject) => this.pending.set(taskId, { resolve, reject, onProgress }));
    const message: WorkerTaskMessage = { taskId, task, stopFlag };
    worker.postMessage(message);
    let killTimer: NodeJS.Timeout | null = null;
    void done.finally(() => killTimer && clearTimeout(killTimer)).catch(() => {});
    return {
      done,
      stop: () => {
        Atomics.store(new Int32Array(stopFlag), 0, 1);
        killTimer ??= setTimeout(() => {
          // The task did not stop by itself: end the thread; its tasks count as cancelled.
          if (this.worker === worker) this.worker = null;
          this.settleAll({ taskId, type: 'solved', outcome: { kind: 'cancelled', seconds: 0 } });
          void worker.terminate();
        }, stopGraceMs);
      },
    };
  }

  /** Starts the thread and loads the solvers of `kind` now, so the first job does not wait for them. */
  warm(kind: WorkerTask['kind']): void {
    const message: WorkerWarmMessage = { warm: kind };
    this.ensureWorker().postMessage(message);
  }

  async close(): Promise<void> {
    const worker = this.worker;
    this.worker = null;
    if (worker) await worker.terminate();
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    bootstrap ??= bootstrapSource(workerEntry);
    const worker = new Worker(bootstrap, { eval: true });
    worker.unref();
    worker.on('message', (m: WorkerMessage) => {
      const entry = this.pending.get(m.taskId);
      if (!entry) return;
      if (m.type === 'progress') return entry.onProgress(m.progress);
      this.pending.delete(m.taskId);
      entry.resolve(m);
    });
    const fail = (err: Error) => {
      if (this.worker === worker) this.worker = null;
      for (const [id, entry] of this.pending) {
        this.pending.delete(id);
        entry.reject(err);
      }
    };
    worker.on('error', fail);
    worker.on('exit', (code) => fail(new Error(`The solver thread stopped (exit code ${code}) without an answer.`)));
    this.worker = worker;
    return worker;
  }

  /** Answers every waiting task with `reply` (used when the thread is terminated). */
  private settleAll(reply: WorkerReply): void {
    for (const [id, entry] of this.pending) {
      this.pending.delete(id);
      entry.resolve({ ...reply, taskId: id });
    }
  }
}
