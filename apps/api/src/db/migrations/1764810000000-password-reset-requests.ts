import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Requests for password-reset links, counted for their rate limit (per e-mail + IP and per IP). */
export class PasswordResetRequests1764810000000 implements MigrationInterface {
  name = 'PasswordResetRequests1764810000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE password_reset_request (
        id BIGINT NOT NULL AUTO_INCREMENT,
        email VARCHAR(254) NOT NULL,
        ip VARCHAR(64) NOT NULL,
        requested_at DATETIME(3) NOT NULL,
        PRIMARY KEY (id),
        KEY ix_password_reset_request_key (email, ip, requested_at),
        KEY ix_password_reset_request_ip (ip, requested_at)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE password_reset_request');
  }
}
