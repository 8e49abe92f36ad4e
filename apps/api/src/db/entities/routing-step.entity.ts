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
    setupHours: { name: 'setup_hours', type: 'decimal', precision: 12, scale: 4, transformer: decimalAsNumber },
  },
});
