import { EntitySchema } from 'typeorm';
import type { ProductKind } from '@millrace/contracts';
import { decimalAsNumber } from './column-types';

/** A finished good or sub-assembly. Table `product`. */
export interface ProductRow {
  id: number;
  code: string;
  name: string;
  unit: string;
  kind: ProductKind;
  price: number;
  holdingCostRatePct: number;
  safetyStock: number;
  batchMultiple: number;
  openingStock: number;
  latePenalty: number;
  family: string | null;
  active: boolean;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

const decimal = (name: string, precision = 14, scale = 4) =>
  ({ name, type: 'decimal', precision, scale, transformer: decimalAsNumber }) as const;

export const ProductEntity = new EntitySchema<ProductRow>({
  name: 'Product',
  tableName: 'product',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    code: { type: 'varchar', length: 40 },
    name: { type: 'varchar', length: 120 },
    unit: { type: 'varchar', length: 16 },
    kind: { type: 'varchar', length: 12 },
    price: decimal('price'),
    holdingCostRatePct: decimal('holding_cost_rate_pct', 7, 3),
    safetyStock: decimal('safety_stock'),
    batchMultiple: decimal('batch_multiple'),
    openingStock: decimal('opening_stock'),
    latePenalty: decimal('late_penalty'),
    family: { type: 'varchar', length: 40, nullable: true },
    active: { type: 'boolean', width: 1, default: true },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
  indices: [
    { name: 'uq_product_code', columns: ['code'], unique: true },
    { name: 'ix_product_name', columns: ['name'] },
    { name: 'ix_product_family', columns: ['family'] },
    { name: 'ix_product_kind', columns: ['kind'] },
  ],
});
