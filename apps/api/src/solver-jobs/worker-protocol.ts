import type { CrossCheck } from '@millrace/contracts';
import type { ComputeOutcome, ComputeProgress, ComputeRequest } from './compute-plan';
import type { CrossCheckRequest, CrossCheckSettings } from './cross-check-plan';

/** What a solver worker thread is asked to do. */
export type WorkerTask =
  | { kind: 'solve'; request: ComputeRequest }
  | { kind: 'cross_check'; request: CrossCheckRequest; settings: CrossCheckSettings };

/** A task sent to the thread, with its shared stop flag (Int32Array over it; 1 = stop). */
export interface WorkerTaskMessage {
  taskId: number;
  task: WorkerTask;
  stopFlag: SharedArrayBuffer;
}

/** Asks an idle thread to load the solvers of one kind of task ahead of the first job. */
export interface WorkerWarmMessage {
  warm: WorkerTask['kind'];
}

/** Messages from the worker thread back to the job runner, tagged with the task they belong to. */
export type WorkerMessage = { taskId: number } & (
  | { type: 'progress'; progress: ComputeProgress }
  | { type: 'solved'; outcome: ComputeOutcome }
  | { type: 'cross_checked'; crossCheck: CrossCheck }
  | { type: 'error'; message: string }
);
