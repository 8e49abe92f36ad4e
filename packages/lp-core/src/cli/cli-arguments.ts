/**
 * Command-line arguments of `lp-core`:
 *
 *   lp-core solve FILE.mps[.gz] [--json] [--solver ipm|barrier] [--time-limit SECONDS] [--format auto|fixed|free]
 *
 * Parsed once into a typed value; anything else is a CliUsageError (exit code 2).
 */
export type CliSolver = 'ipm' | 'barrier';

export interface SolveCommand {
  command: 'solve';
  file: string;
  json: boolean;
  solver: CliSolver;
  timeLimitSeconds?: number;
  format: 'auto' | 'fixed' | 'free';
}

export type CliCommand = SolveCommand | { command: 'help' };

export const USAGE = `usage: lp-core solve FILE.mps[.gz] [--json] [--solver ipm|barrier] [--time-limit SECONDS] [--format auto|fixed|free]
  --json         print exactly one JSON line: {status, objective, iterations, seconds, primalResidual, dualResidual, relativeGap, …}
  --solver       ipm (interior point, default) or barrier (log-barrier method, dense; small problems)
  --time-limit   wall-clock limit in seconds
  --format       MPS layout; auto (default) tries free format, then fixed`;

export class CliUsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliUsageError';
  }
}

export function parseCliArguments(argv: string[]): CliCommand {
  const [command, ...rest] = argv;
  if (command === undefined) throw new CliUsageError('missing command: expected "solve"');
  if (command === '--help' || command === '-h' || command === 'help') return { command: 'help' };
  if (command !== 'solve') throw new CliUsageError(`unknown command '${command}': expected "solve"`);

  const parsed: SolveCommand = { command: 'solve', file: '', json: false, solver: 'ipm', format: 'auto' };
  for (let k = 0; k < rest.length; k++) {
    const arg = rest[k];
    const value = () => {
      const v = rest[++k];
      if (v === undefined || v.startsWith('--')) throw new CliUsageError(`${arg} needs a value`);
      return v;
    };
    if (arg === '--json') parsed.json = true;
    else if (arg === '--solver') {
      const v = value();
      if (v !== 'ipm' && v !== 'barrier') throw new CliUsageError(`--solver must be ipm or barrier, got '${v}'`);
      parsed.solver = v;
    } else if (arg === '--time-limit') {
      const v = value();
      const seconds = Number(v);
      if (!(seconds > 0) || !Number.isFinite(seconds)) throw new CliUsageError(`--time-limit must be a positive number of seconds, got '${v}'`);
      parsed.timeLimitSeconds = seconds;
    } else if (arg === '--format') {
      const v = value();
      if (v !== 'auto' && v !== 'fixed' && v !== 'free') throw new CliUsageError(`--format must be auto, fixed or free, got '${v}'`);
      parsed.format = v;
    } else if (arg.startsWith('--')) throw new CliUsageError(`unknown option '${arg}'`);
    else if (parsed.file === '') parsed.file = arg;
    else throw new CliUsageError(`unexpected argument '${arg}': only one file can be solved`);
  }
  if (parsed.file === '') throw new CliUsageError('missing FILE.mps');
  return parsed;
}
