import type { MigrationInterface, QueryRunner } from 'typeorm';

/** People (the lucia user table), lucia sessions, and failed sign-ins for the rate limit. */
export class PeopleAndSessions1764633600000 implements MigrationInterface {
  name = 'PeopleAndSessions1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE person (
        id INT NOT NULL AUTO_INCREMENT,
        email VARCHAR(254) NOT NULL,
        name VARCHAR(120) NOT NULL,
        role VARCHAR(20) NOT NULL,
        password_hash VARCHAR(255) NULL,
        active TINYINT(1) NOT NULL DEFAULT 1,
        version INT NOT NULL DEFAULT 1,
        created_at DATETIME(3) NOT NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_person_email (email),
        CONSTRAINT ck_person_role CHECK (role IN ('admin', 'planner', 'supervisor', 'floor_lead'))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await q.query(`
      CREATE TABLE session (
        id VARCHAR(255) NOT NULL,
        user_id INT NOT NULL,
        expires_at DATETIME NOT NULL,
        PRIMARY KEY (id),
        KEY ix_session_user (user_id),
        CONSTRAINT fk_session_person FOREIGN KEY (user_id) REFERENCES person (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await q.query(`
      CREATE TABLE sign_in_attempt (
        id BIGINT NOT NULL AUTO_INCREMENT,
        email VARCHAR(254) NOT NULL,
        ip VARCHAR(64) NOT NULL,
        attempted_at DATETIME(3) NOT NULL,
        PRIMARY KEY (id),
        KEY ix_sign_in_attempt_key (email, ip, attempted_at)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE sign_in_attempt');
    await q.query('DROP TABLE session');
    await q.query('DROP TABLE person');
  }
}
