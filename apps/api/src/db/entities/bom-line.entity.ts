import { EntitySchema } from 'typeorm';
import { decimalAsNumber } from './column-types';

/** One bill-of-materials line: exactly one of component product / material. Table `bom_line`. */
export interface BomLineRow {
  id: number;
  parentProductId: number;
  position: number;
  componentProductId: number | null;
  materialId: number | null;
  qtyPer: number;
  scrapPct: number;
}

export const BomLineEntity = new EntitySchema<BomLineRow>({
  name: 'BomLine',
  tableName: 'bom_line',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    parentProductId: { name: 'parent_product_id', type: 'int' },
    position: { type: 'int' },
    componentProductId: { name: 'component_product_id', type: 'int', nullable: true },
    materialId: { name: 'material_id', type: 'int', nullable: true },
    qtyPer: { name: 'qty_per', type: 'decimal', precision: 16, scale: 6, transformer: decimalAsNumber },
    scrapPct: { name: 'scrap_pct', type: 'decimal', precision: 6, scale: 3, transformer: decimalAsNumber },
  },
});
