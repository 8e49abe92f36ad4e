import type { CrossCheck } from '@millrace/contracts';
import type { ComputeOutcome, ComputeProgress, ComputeRequest } from './compute-plan';
import type { CrossCheckRequest, CrossCheckSettings } from './cross-check-plan';

/** What a solver worker thread is asked to do. */
export type WorkerTask =
  | { kind: 'solve'; request: ComputeRequest }
  | { kind: 'cross_check'; request: CrossCheckRequest; settings: CrossCheckSettings };

/** Messages from the worker thread back to the job runner. */
export type WorkerMessage =
  | { type: 'progress'; progress: ComputeProgress }
  | { type: 'solved'; outcome: ComputeOutcome }
  | { type: 'cross_checked'; crossCheck: CrossCheck }
  | { type: 'error'; message: string };

/** workerData of a solver worker: the task and a shared stop flag (Int32Array over it; 1 = stop). */
export interface WorkerInput {
  task: WorkerTask;
  stopFlag: SharedArrayBuffer;
}
