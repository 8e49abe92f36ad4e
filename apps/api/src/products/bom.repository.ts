import type { EntityManager } from 'typeorm';
import type { BomLine, BomLineInput } from '@millrace/contracts';
import { BomLineEntity } from '../db/entities/bom-line.entity';

interface BomLineJoined {
  id: number;
  position: number;
  component_product_id: number | null;
  cp_code: string | null;
  cp_name: string | null;
  cp_unit: string | null;
  material_id: number | null;
  m_code: string | null;
  m_name: string | null;
  m_unit: string | null;
  qty_per: string;
  scrap_pct: string;
}

/** A joined BOM row as the contract's line; the unit is the component product's or the material's. */
function toBomLine(r: BomLineJoined): BomLine {
  return {
    id: r.id,
    position: r.position,
    componentProductId: r.component_product_id,
    componentProductCode: r.cp_code,
    componentProductName: r.cp_name,
    materialId: r.material_id,
    materialCode: r.m_code,
    materialName: r.m_name,
    unit: r.cp_unit ?? r.m_unit ?? '',
    qtyPer: Number(r.qty_per),
    scrapPct: Number(r.scrap_pct),
  };
}

/** The BOM lines of a parent product, in their saved order, with component codes and names. */
export async function listBomLines(db: EntityManager, parentId: number): Promise<BomLine[]> {
  const rows = (await db.query(
    `SELECT b.id, b.position, b.component_product_id, cp.code AS cp_code, cp.name AS cp_name, cp.unit AS cp_unit,
            b.material_id, m.code AS m_code, m.name AS m_name, m.unit AS m_unit, b.qty_per, b.scrap_pct
       FROM bom_line b
       LEFT JOIN product cp ON cp.id = b.component_product_id
       LEFT JOIN material m ON m.id = b.material_id
      WHERE b.parent_product_id = ?
      ORDER BY b.position, b.id`,
    [parentId],
  )) as BomLineJoined[];
  return rows.map(toBomLine);
}

/** Replaces all BOM lines of a parent (inside the caller's transaction). */
export async function replaceBomLines(db: EntityManager, parentId: number, lines: BomLineInput[]): Promise<void> {
  const repo = db.getRepository(BomLineEntity);
  await repo.delete({ parentProductId: parentId });
  if (lines.length === 0) return;
  await repo.insert(
    lines.map((l, i) => ({
      parentProductId: parentId,
      position: i + 1,
      componentProductId: l.componentProductId,
      materialId: l.materialId,
      qtyPer: l.qtyPer,
      scrapPct: l.scrapPct,
    })),
  );
}

/** Every product-to-product BOM edge in the database, by code (for the cycle check). */
export async function listProductEdges(db: EntityManager): Promise<Array<{ parent: string; child: string }>> {
  const rows = (await db.query(
    `SELECT p.code AS parent, c.code AS child
       FROM bom_line b JOIN product p ON p.id = b.parent_product_id JOIN product c ON c.id = b.component_product_id`,
  )) as Array<{ parent: string; child: string }>;
  return rows;
}

/**
 * Serialises BOM structure changes across API processes (two concurrent saves could otherwise
 * close a cycle together): the plant settings row serves as the lock.
 */
export async function lockBomStructure(db: EntityManager): Promise<void> {
  await db.query('SELECT id FROM plant_settings WHERE id = 1 FOR UPDATE');
}

/** Every BOM line of every parent, with codes and units, in parent code and saved order (exports, imports). */
export async function listAllBomLines(db: EntityManager): Promise<Array<BomLine & { parentProductId: number; parentCode: string }>> {
  const rows = (await db.query(
    `SELECT b.id, b.parent_product_id, pp.code AS parent_code, b.position, b.component_product_id, cp.code AS cp_code, cp.name AS cp_name, cp.unit AS cp_unit,
            b.material_id, m.code AS m_code, m.name AS m_name, m.unit AS m_unit, b.qty_per, b.scrap_pct
       FROM bom_line b
       JOIN product pp ON pp.id = b.parent_product_id
       LEFT JOIN product cp ON cp.id = b.component_product_id
       LEFT JOIN material m ON m.id = b.material_id
      ORDER BY pp.code, b.position, b.id`,
  )) as Array<BomLineJoined & { parent_product_id: number; parent_code: string }>;
  return rows.map((r) => ({ ...toBomLine(r), parentProductId: r.parent_product_id, parentCode: r.parent_code }));
}
