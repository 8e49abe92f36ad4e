import { resolve } from 'node:path';
import { roles, type Role } from '@millrace/contracts';
import { closeSheetPrinters } from '../../src/shift-sheets/sheet-printer';
import { SolverJobRunner } from '../../src/solver-jobs/solver-job-runner';
import { seedSmallPlant, type SmallPlant } from '../support/small-plant';
import { createTestContext, type TestAgent, type TestContext } from '../support/test-app';

/** A test app that can print sheets to PDF: the built planner, every role signed in, the small plant, a solver runner. */
export interface PrintingContext {
  ctx: TestContext;
  agents: Record<Role, TestAgent>;
  plant: SmallPlant;
  close(): Promise<void>;
}

export async function startPrintingContext(): Promise<PrintingContext> {
  const plannerDist = process.env.PLANNER_DIST;
  if (!plannerDist) throw new Error('These tests print the planner’s print view to PDF: set PLANNER_DIST to the built planner (npm run build -w apps/planner). The README test command sets it.');
  const ctx = await createTestContext({ config: { plannerDist: resolve(plannerDist) } });
  const agents = {} as Record<Role, TestAgent>;
  for (const role of roles) agents[role] = await ctx.agentFor(role);
  const plant = await seedSmallPlant(agents.planner);
  const runner = new SolverJobRunner(ctx.dataSource, { pollMs: 100 });
  runner.start();
  return {
    ctx,
    agents,
    plant,
    async close() {
      await closeSheetPrinters();
      await runner.stop();
      await ctx.close();
    },
  };
}
