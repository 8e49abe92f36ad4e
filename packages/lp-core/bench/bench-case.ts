/** What one benchmark run solves and with which solver, and what it reports back. */
import type { SolveStatus } from '../src/solution/result';

export type BenchSolver = 'lp-core' | 'highs-simplex' | 'highs-ipm' | 'lp-solver';
export const BENCH_SOLVERS: BenchSolver[] = ['lp-core', 'highs-simplex', 'highs-ipm', 'lp-solver'];

export type BenchProblem = { kind: 'planning'; size: 'S' | 'M' | 'L' | 'XL'; seed: number } | { kind: 'netlib'; name: string; file: string };

export interface BenchRequest {
  problem: BenchProblem;
  solver: BenchSolver;
  timeLimitSeconds: number;
}

export interface BenchOutcome {
  status: SolveStatus | 'killed' | 'failed' | 'skipped';
  objective: number | null;
  iterations: number | null;
  /** solver time only (problem generation excluded) */
  seconds: number | null;
  /** peak resident memory of the whole child process, kB */
  maxRssKb: number | null;
  rows: number | null;
  cols: number | null;
  nonzeros: number | null;
  message?: string;
}

export function problemLabel(p: BenchProblem): string {
  return p.kind === 'planning' ? `planning ${p.size}` : `netlib ${p.name}`;
}
