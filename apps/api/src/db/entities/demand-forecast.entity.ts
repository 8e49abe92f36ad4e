import { EntitySchema } from 'typeorm';
import { decimalAsNumber } from './column-types';

/** The forecast quantity of a product in a week (one per product-week). Table `demand_forecast`. */
export interface DemandForecastRow {
  id: number;
  productId: number;
  weekStart: string;
  qty: number;
  version: number;
  createdAt: Date;
  updatedAt: Date;
  product?: unknown;
}

export const DemandForecastEntity = new EntitySchema<DemandForecastRow>({
  name: 'DemandForecast',
  tableName: 'demand_forecast',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    productId: { name: 'product_id', type: 'int' },
    weekStart: { name: 'week_start', type: 'date' },
    qty: { type: 'decimal', precision: 14, scale: 4, transformer: decimalAsNumber },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
  relations: {
    product: {
      type: 'many-to-one',
      target: 'Product',
      joinColumn: { name: 'product_id', foreignKeyConstraintName: 'fk_demand_forecast_product' },
      onDelete: 'RESTRICT',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [
    { name: 'uq_demand_forecast', columns: ['productId', 'weekStart'], unique: true },
    { name: 'ix_demand_forecast_week', columns: ['weekStart'] },
  ],
});
