import type { MigrationInterface, QueryRunner } from 'typeorm';

const table = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci';

/**
 * Spreadsheet imports: every applied import with its original file (up to the 10 MB upload
 * limit), who applied it and when, its summary and what undo needs; and the column mapping
 * saved per kind of import.
 */
export class Imports1764806400000 implements MigrationInterface {
  name = 'Imports1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE import_run (
        id INT NOT NULL AUTO_INCREMENT,
        kind VARCHAR(20) NOT NULL,
        file_name VARCHAR(200) NOT NULL,
        file_format VARCHAR(4) NOT NULL,
        file_bytes INT NOT NULL,
        file_content LONGBLOB NOT NULL,
        sheet VARCHAR(100) NULL,
        header_row INT NOT NULL,
        mapping TEXT NOT NULL,
        row_count INT NOT NULL,
        summary VARCHAR(400) NOT NULL,
        undo_data LONGTEXT NOT NULL,
        state VARCHAR(10) NOT NULL,
        applied_by INT NULL,
        applied_at DATETIME(3) NOT NULL,
        undone_by INT NULL,
        undone_at DATETIME(3) NULL,
        PRIMARY KEY (id),
        KEY ix_import_run_kind (kind, id),
        CONSTRAINT fk_import_run_applied_by FOREIGN KEY (applied_by) REFERENCES person (id) ON DELETE SET NULL,
        CONSTRAINT fk_import_run_undone_by FOREIGN KEY (undone_by) REFERENCES person (id) ON DELETE SET NULL,
        CONSTRAINT ck_import_run_state CHECK (state IN ('applied','undone')),
        CONSTRAINT ck_import_run_format CHECK (file_format IN ('csv','xlsx'))
      ) ${table}`);
    await q.query(`
      CREATE TABLE import_mapping (
        kind VARCHAR(20) NOT NULL,
        mapping TEXT NOT NULL,
        updated_by INT NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (kind),
        CONSTRAINT fk_import_mapping_person FOREIGN KEY (updated_by) REFERENCES person (id) ON DELETE SET NULL
      ) ${table}`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE import_mapping');
    await q.query('DROP TABLE import_run');
  }
}
