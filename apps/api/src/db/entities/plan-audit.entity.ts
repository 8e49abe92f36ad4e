import { EntitySchema } from 'typeorm';
import type { PlanState, Role } from '@millrace/contracts';

/**
 * One row of the append-only audit trail of plan versions. Table `plan_audit`; database
 * triggers refuse UPDATE and DELETE on it.
 */
export interface PlanAuditRow {
  id: number;
  planId: number;
  at: Date;
  actorId: number | null;
  actorName: string;
  actorRole: Role | null;
  action: string;
  fromState: PlanState | null;
  toState: PlanState;
  comment: string | null;
  inputsHash: string;
  resultsHash: string | null;
}

export const PlanAuditEntity = new EntitySchema<PlanAuditRow>({
  name: 'PlanAudit',
  tableName: 'plan_audit',
  columns: {
    id: { type: 'bigint', primary: true, generated: 'increment' },
    planId: { name: 'plan_id', type: 'int' },
    at: { type: 'datetime', precision: 3 },
    actorId: { name: 'actor_id', type: 'int', nullable: true },
    actorName: { name: 'actor_name', type: 'varchar', length: 120 },
    actorRole: { name: 'actor_role', type: 'varchar', length: 20, nullable: true },
    action: { type: 'varchar', length: 20 },
    fromState: { name: 'from_state', type: 'varchar', length: 20, nullable: true },
    toState: { name: 'to_state', type: 'varchar', length: 20 },
    comment: { type: 'text', nullable: true },
    inputsHash: { name: 'inputs_hash', type: 'char', length: 64 },
    resultsHash: { name: 'results_hash', type: 'char', length: 64, nullable: true },
  },
});
