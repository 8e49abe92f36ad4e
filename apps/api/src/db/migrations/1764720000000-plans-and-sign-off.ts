import type { MigrationInterface, QueryRunner } from 'typeorm';

const table = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci';

/**
 * Plan versions with their input snapshot and results, scenarios, the solver job queue, the
 * append-only audit trail (UPDATE and DELETE refused by triggers) and the e-mail outbox.
 */
export class PlansAndSignOff1764720000000 implements MigrationInterface {
  name = 'PlansAndSignOff1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE scenario (
        id INT NOT NULL AUTO_INCREMENT,
        name VARCHAR(120) NOT NULL,
        description TEXT NOT NULL,
        overrides LONGTEXT NOT NULL,
        version INT NOT NULL DEFAULT 1,
        created_by INT NULL,
        created_at DATETIME(3) NOT NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_scenario_name (name),
        CONSTRAINT fk_scenario_person FOREIGN KEY (created_by) REFERENCES person (id) ON DELETE SET NULL
      ) ${table}`);
    await q.query(`
      CREATE TABLE plan_version (
        id INT NOT NULL AUTO_INCREMENT,
        name VARCHAR(120) NOT NULL,
        state VARCHAR(20) NOT NULL,
        solve_status VARCHAR(20) NOT NULL,
        horizon_weeks INT NOT NULL,
        first_week CHAR(10) NOT NULL,
        last_week CHAR(10) NOT NULL,
        scenario_id INT NULL,
        scenario_name VARCHAR(120) NULL,
        smoothing_enabled TINYINT(1) NOT NULL,
        smoothing_weight DOUBLE NOT NULL,
        whole_units TINYINT(1) NOT NULL,
        currency VARCHAR(3) NOT NULL,
        inputs LONGTEXT NOT NULL,
        inputs_hash CHAR(64) NOT NULL,
        objective DOUBLE NULL,
        certificate LONGTEXT NULL,
        cross_check LONGTEXT NULL,
        results LONGTEXT NULL,
        results_hash CHAR(64) NULL,
        check_violations LONGTEXT NULL,
        rounding LONGTEXT NULL,
        infeasibility LONGTEXT NULL,
        solve_message TEXT NULL,
        model_rows INT NULL,
        model_columns INT NULL,
        model_nonzeros INT NULL,
        mps LONGTEXT NULL,
        latest_run_id INT NULL,
        created_by INT NULL,
        submitted_by INT NULL,
        version INT NOT NULL DEFAULT 1,
        created_at DATETIME(3) NOT NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (id),
        KEY ix_plan_version_state (state, first_week),
        CONSTRAINT ck_plan_version_state CHECK (state IN ('draft', 'submitted', 'approved', 'returned', 'released', 'superseded')),
        CONSTRAINT ck_plan_version_horizon CHECK (horizon_weeks BETWEEN 1 AND 104),
        CONSTRAINT fk_plan_version_scenario FOREIGN KEY (scenario_id) REFERENCES scenario (id) ON DELETE SET NULL,
        CONSTRAINT fk_plan_version_created_by FOREIGN KEY (created_by) REFERENCES person (id) ON DELETE SET NULL,
        CONSTRAINT fk_plan_version_submitted_by FOREIGN KEY (submitted_by) REFERENCES person (id) ON DELETE SET NULL
      ) ${table}`);
    await q.query(`
      CREATE TABLE solve_job (
        id INT NOT NULL AUTO_INCREMENT,
        plan_id INT NOT NULL,
        kind VARCHAR(20) NOT NULL,
        state VARCHAR(20) NOT NULL,
        cancel_requested TINYINT(1) NOT NULL DEFAULT 0,
        iteration INT NOT NULL DEFAULT 0,
        relative_gap DOUBLE NULL,
        primal_objective DOUBLE NULL,
        elapsed_seconds DOUBLE NOT NULL DEFAULT 0,
        message TEXT NULL,
        claimed_by VARCHAR(100) NULL,
        heartbeat_at DATETIME(3) NULL,
        created_at DATETIME(3) NOT NULL,
        started_at DATETIME(3) NULL,
        finished_at DATETIME(3) NULL,
        PRIMARY KEY (id),
        KEY ix_solve_job_claim (state, id),
        KEY ix_solve_job_plan (plan_id, id),
        CONSTRAINT ck_solve_job_kind CHECK (kind IN ('solve', 'cross_check')),
        CONSTRAINT ck_solve_job_state CHECK (state IN ('queued', 'running', 'finished', 'failed', 'cancelled')),
        CONSTRAINT fk_solve_job_plan FOREIGN KEY (plan_id) REFERENCES plan_version (id) ON DELETE CASCADE
      ) ${table}`);
    await q.query(`
      CREATE TABLE plan_audit (
        id BIGINT NOT NULL AUTO_INCREMENT,
        plan_id INT NOT NULL,
        at DATETIME(3) NOT NULL,
        actor_id INT NULL,
        actor_name VARCHAR(120) NOT NULL,
        actor_role VARCHAR(20) NULL,
        action VARCHAR(20) NOT NULL,
        from_state VARCHAR(20) NULL,
        to_state VARCHAR(20) NOT NULL,
        comment TEXT NULL,
        inputs_hash CHAR(64) NOT NULL,
        results_hash CHAR(64) NULL,
        PRIMARY KEY (id),
        KEY ix_plan_audit_plan (plan_id, id),
        CONSTRAINT fk_plan_audit_plan FOREIGN KEY (plan_id) REFERENCES plan_version (id)
      ) ${table}`);
    await q.query(`
      CREATE TRIGGER plan_audit_no_update BEFORE UPDATE ON plan_audit FOR EACH ROW
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'plan_audit is append-only'`);
    await q.query(`
      CREATE TRIGGER plan_audit_no_delete BEFORE DELETE ON plan_audit FOR EACH ROW
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'plan_audit is append-only'`);
    await q.query(`
      CREATE TABLE outbox_message (
        id BIGINT NOT NULL AUTO_INCREMENT,
        to_address VARCHAR(254) NOT NULL,
        subject VARCHAR(255) NOT NULL,
        text_body MEDIUMTEXT NOT NULL,
        html_body MEDIUMTEXT NOT NULL,
        event VARCHAR(40) NOT NULL,
        plan_id INT NULL,
        state VARCHAR(20) NOT NULL,
        attempts INT NOT NULL DEFAULT 0,
        next_attempt_at DATETIME(3) NULL,
        leased_until DATETIME(3) NULL,
        last_error TEXT NULL,
        created_at DATETIME(3) NOT NULL,
        sent_at DATETIME(3) NULL,
        PRIMARY KEY (id),
        KEY ix_outbox_due (state, next_attempt_at),
        CONSTRAINT ck_outbox_state CHECK (state IN ('pending', 'sent', 'failed')),
        CONSTRAINT fk_outbox_plan FOREIGN KEY (plan_id) REFERENCES plan_version (id) ON DELETE SET NULL
      ) ${table}`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE outbox_message');
    await q.query('DROP TRIGGER plan_audit_no_delete');
    await q.query('DROP TRIGGER plan_audit_no_update');
    await q.query('DROP TABLE plan_audit');
    await q.query('DROP TABLE solve_job');
    await q.query('DROP TABLE plan_version');
    await q.query('DROP TABLE scenario');
  }
}
