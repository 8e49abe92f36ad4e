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
  parent?: unknown;
  componentProduct?: unknown;
  material?: unknown;
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
    scrapPct: { name: 'scrap_pct', type: 'decimal', precision: 6, scale: 3, default: 0, transformer: decimalAsNumber },
  },
  relations: {
    parent: {
      type: 'many-to-one',
      target: 'Product',
      joinColumn: { name: 'parent_product_id', foreignKeyConstraintName: 'fk_bom_line_parent' },
      onDelete: 'CASCADE',
      onUpdate: 'RESTRICT',
    },
    componentProduct: {
      type: 'many-to-one',
      target: 'Product',
      joinColumn: { name: 'component_product_id', foreignKeyConstraintName: 'fk_bom_line_component' },
      onDelete: 'RESTRICT',
      onUpdate: 'RESTRICT',
    },
    material: {
      type: 'many-to-one',
      target: 'Material',
      joinColumn: { name: 'material_id', foreignKeyConstraintName: 'fk_bom_line_material' },
      onDelete: 'RESTRICT',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [
    { name: 'ix_bom_line_parent', columns: ['parentProductId', 'position'] },
    { name: 'ix_bom_line_component', columns: ['componentProductId'] },
    { name: 'ix_bom_line_material', columns: ['materialId'] },
  ],
});
