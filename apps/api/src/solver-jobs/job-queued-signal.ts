import { EventEmitter } from 'node:events';
import type { SolveJobKind } from '../db/entities/solve-job.entity';

/**
 * In-process notice that a solver job was queued (sent after its transaction committed): a
 * runner in this process claims it at once instead of at its next poll. Runners in other
 * processes still find it by polling the job table.
 */
const queued = new EventEmitter();

export function signalJobQueued(kind: SolveJobKind): void {
  queued.emit('queued', kind);
}

/** Calls `listener` for every job queued in this process; returns the function that stops it. */
export function onJobQueued(listener: (kind: SolveJobKind) => void): () => void {
  queued.on('queued', listener);
  return () => {
    queued.off('queued', listener);
  };
}
