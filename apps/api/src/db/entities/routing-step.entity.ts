import { EntitySchema } from 'typeorm';
import { decimalAsNumber } from './column-types';

/** One routing step of a product. Table `routing_step`. */
export interface RoutingStepRow {
  id: number;
  productId: number;
  sequence: number;
  workCenterId: number;
  hoursPerUnit: number;
  setupHours: number;
  product?: unknown;
  workCenter?: unknown;
}

export const RoutingStepEntity = new EntitySchema<RoutingStepRow>({
  name: 'RoutingStep',
  tableName: 'routing_step',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    productId: { name: 'product_id', type: 'int' },
    sequence: { type: 'int' },
    workCenterId: { name: 'work_center_id', type: 'int' },
    hoursPerUnit: { name: 'hours_per_unit', type: 'decimal', precision: 12, scale: 6, transformer: decimalAsNumber },
    setupHours: { name: 'setup_hours', type: 'decimal', precision: 12, scale: 4, default: 0, transformer: decimalAsNumber },
  },
  relations: {
    product: {
      type: 'many-to-one',
      target: 'Product',
      joinColumn: { name: 'product_id', foreignKeyConstraintName: 'fk_routing_step_product' },
      onDelete: 'CASCADE',
      onUpdate: 'RESTRICT',
    },
    workCenter: {
      type: 'many-to-one',
      target: 'WorkCenter',
      joinColumn: { name: 'work_center_id', foreignKeyConstraintName: 'fk_routing_step_wc' },
      onDelete: 'RESTRICT',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [
    { name: 'uq_routing_step', columns: ['productId', 'sequence'], unique: true },
    { name: 'ix_routing_step_wc', columns: ['workCenterId'] },
  ],
});
