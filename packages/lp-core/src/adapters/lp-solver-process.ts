/**
 * Child-process side of solveWithLpSolver: receives one javascript-lp-solver model over IPC,
 * solves it, sends back the raw result and this process's peak resident memory, and exits.
 * Kept in its own process so the parent can kill a stalled simplex at a hard time limit.
 */
import solver from 'javascript-lp-solver';
import type { LpSolverModel, LpSolverReply } from './lp-solver-model';

process.once('message', (model: LpSolverModel) => {
  const start = performance.now();
  let reply: LpSolverReply;
  try {
    const raw = solver.Solve(model) as Record<string, number | boolean | undefined>;
    reply = { kind: 'solved', raw, seconds: (performance.now() - start) / 1000, maxRssKb: process.resourceUsage().maxRSS };
  } catch (error) {
    reply = { kind: 'failed', message: error instanceof Error ? error.message : String(error) };
  }
  process.send!(reply, () => process.exit(0));
});
