import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Which work centers a person is assigned to (floor leads see only their work centers' shift
 * sheets). Deleting a person or a work center removes the link with it.
 */
export class PersonWorkCenters1764817200000 implements MigrationInterface {
  name = 'PersonWorkCenters1764817200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE person_work_center (
        person_id INT NOT NULL,
        work_center_id INT NOT NULL,
        PRIMARY KEY (person_id, work_center_id),
        KEY ix_person_work_center_wc (work_center_id),
        CONSTRAINT fk_person_work_center_person FOREIGN KEY (person_id) REFERENCES person (id) ON DELETE CASCADE,
        CONSTRAINT fk_person_work_center_wc FOREIGN KEY (work_center_id) REFERENCES work_center (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE person_work_center');
  }
}
