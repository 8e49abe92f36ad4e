import type { DeepPartial, EntityManager, EntitySchema, FindOptionsWhere } from 'typeorm';
import { definedOnly, updateIfVersion, type VersionedWrite } from './versioned-update';

/** What every coded master-data row has: id, unique code and an optimistic-lock version. */
export interface CodedRow {
  id: number;
  code: string;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

/**
 * The reads and writes that every coded master-data table (products, materials, work centers)
 * has in common; each returns the plain object `toPlain` makes of a row, never the entity.
 */
export function codedTable<Row extends CodedRow, Plain>(entity: EntitySchema<Row>, toPlain: (row: Row) => Plain) {
  const repo = (db: EntityManager) => db.getRepository(entity);
  const where = (w: { id: number } | { code: string }) => w as FindOptionsWhere<Row>;
  return {
    async findById(db: EntityManager, id: number): Promise<Plain | null> {
      const row = await repo(db).findOneBy(where({ id }));
      return row ? toPlain(row) : null;
    },

    async findByCode(db: EntityManager, code: string): Promise<Plain | null> {
      const row = await repo(db).findOneBy(where({ code }));
      return row ? toPlain(row) : null;
    },

    /** Rows by id (for reference checks); missing ids are simply absent from the map. */
    async findByIds(db: EntityManager, ids: number[]): Promise<Map<number, Plain>> {
      if (ids.length === 0) return new Map();
      const rows = await repo(db).createQueryBuilder('t').where('t.id IN (:...ids)', { ids }).getMany();
      return new Map(rows.map((r) => [r.id, toPlain(r)]));
    },

    /** Inserts a row at version 1 and reads it back. */
    async insert(db: EntityManager, columns: DeepPartial<Row>): Promise<Plain> {
      const now = new Date();
      const r = repo(db);
      const saved = await r.save(r.create({ ...columns, version: 1, createdAt: now, updatedAt: now } as DeepPartial<Row>));
      return toPlain(await r.findOneByOrFail(where({ id: saved.id })));
    },

    /** Writes the fields a PATCH body carries (absent ones are `undefined`) if the row is still at `version`. */
    patchIfVersion(db: EntityManager, id: number, input: { version: number }): Promise<VersionedWrite> {
      const { version, ...changes } = input;
      return updateIfVersion(db, entity, id, version, definedOnly(changes));
    },

    /** Bumps the version only (a save of the row's own sub-table counts as a change of it). */
    touchIfVersion(db: EntityManager, id: number, version: number): Promise<VersionedWrite> {
      return updateIfVersion(db, entity, id, version, {});
    },

    async deleteRow(db: EntityManager, id: number): Promise<void> {
      await repo(db).delete(where({ id }));
    },
  };
}
