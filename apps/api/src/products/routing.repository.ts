import type { EntityManager } from 'typeorm';
import type { RoutingStep, RoutingStepInput } from '@millrace/contracts';
import { RoutingStepEntity } from '../db/entities/routing-step.entity';

interface RoutingStepJoined {
  id: number;
  sequence: number;
  work_center_id: number;
  code: string;
  name: string;
  hours_per_unit: string;
  setup_hours: string;
}

/** A routing row joined with its work center, as the contract's step. */
function toRoutingStep(r: RoutingStepJoined): RoutingStep {
  return {
    id: r.id,
    sequence: r.sequence,
    workCenterId: r.work_center_id,
    workCenterCode: r.code,
    workCenterName: r.name,
    hoursPerUnit: Number(r.hours_per_unit),
    setupHours: Number(r.setup_hours),
  };
}

/** The routing steps of a product, in sequence, with work-center codes and names. */
export async function listRoutingSteps(db: EntityManager, productId: number): Promise<RoutingStep[]> {
  const rows = (await db.query(
    `SELECT r.id, r.sequence, r.work_center_id, w.code, w.name, r.hours_per_unit, r.setup_hours
       FROM routing_step r JOIN work_center w ON w.id = r.work_center_id
      WHERE r.product_id = ? ORDER BY r.sequence`,
    [productId],
  )) as RoutingStepJoined[];
  return rows.map(toRoutingStep);
}

/** Replaces all routing steps of a product (inside the caller's transaction). */
export async function replaceRoutingSteps(db: EntityManager, productId: number, steps: RoutingStepInput[]): Promise<void> {
  const repo = db.getRepository(RoutingStepEntity);
  await repo.delete({ productId });
  if (steps.length === 0) return;
  await repo.insert(steps.map((s) => ({ productId, sequence: s.sequence, workCenterId: s.workCenterId, hoursPerUnit: s.hoursPerUnit, setupHours: s.setupHours })));
}

/** Every routing step of every product, in product code and sequence order (exports, imports). */
export async function listAllRoutingSteps(db: EntityManager): Promise<Array<RoutingStep & { productId: number; productCode: string }>> {
  const rows = (await db.query(
    `SELECT r.id, r.product_id, p.code AS product_code, r.sequence, r.work_center_id, w.code, w.name, r.hours_per_unit, r.setup_hours
       FROM routing_step r JOIN work_center w ON w.id = r.work_center_id JOIN product p ON p.id = r.product_id
      ORDER BY p.code, r.sequence`,
  )) as Array<RoutingStepJoined & { product_id: number; product_code: string }>;
  return rows.map((r) => ({ ...toRoutingStep(r), productId: r.product_id, productCode: r.product_code }));
}
