import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A firm order may be marked must-ship: the plan must ship it complete by its week, or be infeasible. */
export class FirmOrderMustShip1764813600000 implements MigrationInterface {
  name = 'FirmOrderMustShip1764813600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE firm_order ADD COLUMN must_ship TINYINT(1) NOT NULL DEFAULT 0 AFTER qty');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE firm_order DROP COLUMN must_ship');
  }
}
