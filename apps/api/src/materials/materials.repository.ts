import type { EntityManager } from 'typeorm';
import type { Material, MaterialCreate, MaterialListQuery, MaterialUpdate, Page, ScheduledReceipt, ScheduledReceiptInput } from '@millrace/contracts';
import { MaterialEntity, type MaterialRow } from '../db/entities/material.entity';
import { ScheduledReceiptEntity } from '../db/entities/scheduled-receipt.entity';
import { codedTable } from '../master-data/coded-table';
import { pageFrom } from '../master-data/list-query';
import type { VersionedWrite } from '../master-data/versioned-update';

export function toMaterial(row: MaterialRow): Material {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    unit: row.unit,
    unitCost: row.unitCost,
    onHand: row.onHand,
    leadTimeWeeks: row.leadTimeWeeks,
    weeklySupplyCap: row.weeklySupplyCap,
    lotRule: row.lotRule,
    lotSize: row.lotSize,
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const sortColumns = {
  code: 't.code',
  name: 't.name',
  unitCost: 't.unitCost',
  onHand: 't.onHand',
  leadTimeWeeks: 't.leadTimeWeeks',
  updatedAt: 't.updatedAt',
} as const;

export async function listMaterials(db: EntityManager, query: MaterialListQuery): Promise<Page<Material>> {
  const qb = db.getRepository(MaterialEntity).createQueryBuilder('t');
  if (query.lotRule) qb.andWhere('t.lotRule = :lotRule', { lotRule: query.lotRule });
  return pageFrom(qb, query, sortColumns, toMaterial);
}

export async function listAllMaterials(db: EntityManager): Promise<Material[]> {
  return (await db.getRepository(MaterialEntity).find({ order: { code: 'ASC' } })).map(toMaterial);
}

const materials = codedTable(MaterialEntity, toMaterial);

export const findMaterialById = materials.findById;
export const findMaterialByCode = materials.findByCode;
export const findMaterialsByIds = materials.findByIds;
export const insertMaterial = (db: EntityManager, input: MaterialCreate): Promise<Material> => materials.insert(db, input);

export const updateMaterialIfVersion = (db: EntityManager, id: number, input: MaterialUpdate): Promise<VersionedWrite> => materials.patchIfVersion(db, id, input);

export const touchMaterialIfVersion = materials.touchIfVersion;
export const deleteMaterialRow = materials.deleteRow;

/** Codes of the products whose bill of materials uses the material. */
export async function materialReferrers(db: EntityManager, id: number): Promise<string[]> {
  const rows = (await db.query(
    `SELECT DISTINCT p.code FROM bom_line b JOIN product p ON p.id = b.parent_product_id WHERE b.material_id = ? ORDER BY p.code`,
    [id],
  )) as Array<{ code: string }>;
  return rows.map((r) => r.code);
}

const receiptColumns = "id, material_id AS materialId, DATE_FORMAT(week_start, '%Y-%m-%d') AS weekStart, qty, reference";
type RawReceipt = { id: number; materialId: number; weekStart: string; qty: string; reference: string | null };

export async function listReceipts(db: EntityManager, materialId: number): Promise<ScheduledReceipt[]> {
  const rows = (await db.query(`SELECT ${receiptColumns} FROM scheduled_receipt WHERE material_id = ? ORDER BY week_start, id`, [materialId])) as RawReceipt[];
  return rows.map((r) => ({ id: r.id, weekStart: r.weekStart, qty: Number(r.qty), reference: r.reference }));
}

/** Every scheduled receipt (planning data). */
export async function listAllReceipts(db: EntityManager): Promise<Array<ScheduledReceipt & { materialId: number }>> {
  const rows = (await db.query(`SELECT ${receiptColumns} FROM scheduled_receipt ORDER BY week_start, id`)) as RawReceipt[];
  return rows.map((r) => ({ id: r.id, materialId: r.materialId, weekStart: r.weekStart, qty: Number(r.qty), reference: r.reference }));
}

export async function replaceReceipts(db: EntityManager, materialId: number, receipts: ScheduledReceiptInput[]): Promise<void> {
  const repo = db.getRepository(ScheduledReceiptEntity);
  await repo.delete({ materialId });
  if (receipts.length === 0) return;
  await repo.insert(receipts.map((r) => ({ materialId, weekStart: r.weekStart, qty: r.qty, reference: r.reference })));
}
