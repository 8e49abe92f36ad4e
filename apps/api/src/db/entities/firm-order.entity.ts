import { EntitySchema } from 'typeorm';
import { decimalAsNumber } from './column-types';

/** A firm customer order line: product, week, quantity, customer order reference. Table `firm_order`. */
export interface FirmOrderRow {
  id: number;
  productId: number;
  weekStart: string;
  orderRef: string;
  qty: number;
  mustShip: boolean;
  version: number;
  createdAt: Date;
  updatedAt: Date;
  product?: unknown;
}

export const FirmOrderEntity = new EntitySchema<FirmOrderRow>({
  name: 'FirmOrder',
  tableName: 'firm_order',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    productId: { name: 'product_id', type: 'int' },
    weekStart: { name: 'week_start', type: 'date' },
    orderRef: { name: 'order_ref', type: 'varchar', length: 60 },
    qty: { type: 'decimal', precision: 14, scale: 4, transformer: decimalAsNumber },
    mustShip: { name: 'must_ship', type: 'boolean', default: false },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
  relations: {
    product: {
      type: 'many-to-one',
      target: 'Product',
      joinColumn: { name: 'product_id', foreignKeyConstraintName: 'fk_firm_order_product' },
      onDelete: 'RESTRICT',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [
    { name: 'uq_firm_order', columns: ['productId', 'weekStart', 'orderRef'], unique: true },
    { name: 'ix_firm_order_week', columns: ['weekStart'] },
  ],
});
