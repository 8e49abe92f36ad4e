/**
 * Solves an LP with javascript-lp-solver (a dense simplex library) for cross-checks. The simplex
 * stalls on some problems, so it runs in a child process (lp-solver-process.ts) that is killed at a
 * hard time limit; the result is then status 'time_limit'. Peak memory of the child is reported.
 */
import { fork } from 'node:child_process';
import { createRequire } from 'node:module';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Problem } from '../problem/problem';
import { certify } from '../solution/certificate';
import { type ColumnShift, type LpSolverModel, type LpSolverReply, fromLpSolverValues, toLpSolverModel } from './lp-solver-model';
import type { ReferenceResult } from './reference-result';

export interface LpSolverSettings {
  /** hard wall-clock limit for the child process, seconds; default 60 */
  timeLimitSeconds?: number;
}

export interface LpSolverResult extends ReferenceResult {
  /** peak resident memory of the child process, kB (absent when it was killed) */
  maxRssKb?: number;
}

const DEFAULT_TIME_LIMIT_SECONDS = 60;
const childScript = fileURLToPath(new URL('./lp-solver-process.ts', import.meta.url));
const tsxLoader = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href;

export async function solveWithLpSolver(problem: Problem, settings: LpSolverSettings = {}): Promise<LpSolverResult> {
  const limit = settings.timeLimitSeconds ?? DEFAULT_TIME_LIMIT_SECONDS;
  if (!(limit > 0)) throw new Error(`solveWithLpSolver: timeLimitSeconds must be positive, got ${limit}`);
  const { model, shifts } = toLpSolverModel(problem);
  const start = performance.now();
  const reply = await runChild(model, limit);
  const seconds = (performance.now() - start) / 1000;
  const empty = new Float64Array(problem.A.n);
  if (reply === 'time_limit') {
    return {
      solver: 'javascript-lp-solver', status: 'time_limit', objective: NaN, x: empty, iterations: 0, seconds,
      message: `javascript-lp-solver did not finish within ${limit} s and was stopped`,
    };
  }
  if (reply.kind === 'failed') {
    return { solver: 'javascript-lp-solver', status: 'numerical_trouble', objective: NaN, x: empty, iterations: 0, seconds, message: reply.message };
  }
  return interpret(problem, reply, shifts, seconds);
}

function interpret(problem: Problem, reply: Extract<LpSolverReply, { kind: 'solved' }>, shifts: ColumnShift, seconds: number): LpSolverResult {
  const { raw } = reply;
  const base = { solver: 'javascript-lp-solver' as const, iterations: 0, seconds, maxRssKb: reply.maxRssKb };
  if (raw.feasible !== true) return { ...base, status: 'infeasible', objective: NaN, x: new Float64Array(problem.A.n) };
  if (raw.bounded === false) return { ...base, status: 'unbounded', objective: NaN, x: new Float64Array(problem.A.n) };
  const x = fromLpSolverValues(raw, shifts);
  const minObjective = Number(raw.result) + shifts.constant + problem.c0;
  const measured = certify(problem, x, new Float64Array(problem.A.m));
  return {
    ...base,
    status: 'optimal',
    objective: problem.maximise ? -minObjective : minObjective,
    x,
    rowActivity: measured.rowActivity,
    message: `primal residual ${measured.certificate.primalResidual.toExponential(2)}; no duals from this library`,
  };
}

function runChild(model: LpSolverModel, limitSeconds: number): Promise<LpSolverReply | 'time_limit'> {
  return new Promise((resolve, reject) => {
    const child = fork(childScript, [], { execArgv: ['--import', tsxLoader], stdio: ['ignore', 'ignore', 'pipe', 'ipc'] });
    let stderr = '';
    let settled = false;
    const finish = (value: LpSolverReply | 'time_limit' | Error) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      if (child.exitCode === null) child.kill('SIGKILL');
      if (value instanceof Error) reject(value);
      else resolve(value);
    };
    const timer = setTimeout(() => finish('time_limit'), limitSeconds * 1000);
    child.stderr?.on('data', (chunk) => (stderr += String(chunk)));
    child.on('message', (reply: LpSolverReply) => finish(reply));
    child.on('error', (error) => finish(error));
    child.on('exit', (code, signal) => {
      if (!settled) finish({ kind: 'failed', message: `javascript-lp-solver process ended (${signal ?? code}) without a result: ${stderr.trim().slice(-500)}` });
    });
    child.send(model);
  });
}
