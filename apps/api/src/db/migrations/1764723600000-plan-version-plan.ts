import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The plan-model Plan a version shows (rounded when whole units were asked), kept as JSON so
 * shift sheets and comparisons can be rebuilt from exactly what was approved.
 */
export class PlanVersionPlan1764723600000 implements MigrationInterface {
  name = 'PlanVersionPlan1764723600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE plan_version ADD COLUMN plan LONGTEXT NULL AFTER results_hash');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE plan_version DROP COLUMN plan');
  }
}
