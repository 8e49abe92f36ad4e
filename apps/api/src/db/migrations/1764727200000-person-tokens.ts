import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Single-use links for invitations and password resets (hash of the secret only). */
export class PersonTokens1764727200000 implements MigrationInterface {
  name = 'PersonTokens1764727200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE person_token (
        id BIGINT NOT NULL AUTO_INCREMENT,
        person_id INT NOT NULL,
        purpose VARCHAR(20) NOT NULL,
        token_hash CHAR(64) NOT NULL,
        expires_at DATETIME(3) NOT NULL,
        used_at DATETIME(3) NULL,
        created_by INT NULL,
        created_at DATETIME(3) NOT NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_person_token_hash (token_hash),
        KEY ix_person_token_person (person_id, purpose),
        CONSTRAINT ck_person_token_purpose CHECK (purpose IN ('invitation', 'password_reset')),
        CONSTRAINT fk_person_token_person FOREIGN KEY (person_id) REFERENCES person (id) ON DELETE CASCADE,
        CONSTRAINT fk_person_token_created_by FOREIGN KEY (created_by) REFERENCES person (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE person_token');
  }
}
