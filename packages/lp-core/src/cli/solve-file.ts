/**
 * The `solve` command: read an MPS file (gzip when it ends in .gz), solve it with the chosen method,
 * and describe the outcome as one flat record. Unreadable files and malformed MPS raise a
 * CliInputError naming the file.
 */
import { readFileSync } from 'node:fs';
import { gunzipSync } from 'node:zlib';
import { solveBarrier } from '../barrier/solve-barrier';
import { readMps } from '../mps/read-mps';
import type { Problem } from '../problem/problem';
import type { SolveResult } from '../solution/result';
import { solve } from '../solve';
import { ProblemInputError } from '../validate';
import type { SolveCommand } from './cli-arguments';

export class CliInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliInputError';
  }
}

export interface SolveReport {
  problem: string;
  solver: SolveCommand['solver'];
  rows: number;
  cols: number;
  nonzeros: number;
  status: SolveResult['status'];
  objective: number | null;
  iterations: number;
  seconds: number;
  primalResidual: number;
  dualResidual: number;
  relativeGap: number;
  integerColumnsRelaxed: number;
  message?: string;
}

export function solveFile(command: SolveCommand): SolveReport {
  const problem = readProblem(command);
  let result: SolveResult;
  try {
    const limits = command.timeLimitSeconds !== undefined ? { timeLimitSeconds: command.timeLimitSeconds } : {};
    result = command.solver === 'barrier' ? solveBarrier(problem, limits) : solve(problem, limits);
  } catch (error) {
    // invalid problem data is reported before any iteration; anything else is a real failure
    if (error instanceof ProblemInputError) throw new CliInputError(`${command.file}: ${error.message}`);
    throw error;
  }
  return {
    problem: problem.name || command.file,
    solver: command.solver,
    rows: problem.A.m,
    cols: problem.A.n,
    nonzeros: problem.A.colPtr[problem.A.n],
    status: result.status,
    objective: Number.isFinite(result.objective) ? result.objective : null,
    iterations: result.iterations,
    seconds: result.seconds,
    primalResidual: result.certificate.primalResidual,
    dualResidual: result.certificate.dualResidual,
    relativeGap: result.certificate.relativeGap,
    integerColumnsRelaxed: problem.integerCols?.length ?? 0,
    ...(result.message ? { message: result.message } : {}),
  };
}

function readProblem(command: SolveCommand): Problem {
  let text: string;
  try {
    const bytes = readFileSync(command.file);
    text = command.file.endsWith('.gz') ? gunzipSync(bytes).toString('utf8') : bytes.toString('utf8');
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new CliInputError(`cannot read ${command.file}: ${reason}`);
  }
  try {
    return readMps(text, { format: command.format });
  } catch (error) {
    throw new CliInputError(`${command.file}: ${error instanceof Error ? error.message : String(error)}`);
  }
}
