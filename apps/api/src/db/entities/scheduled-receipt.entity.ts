import { EntitySchema } from 'typeorm';
import { decimalAsNumber } from './column-types';

/** A purchase already on order: material arriving in a week. Table `scheduled_receipt`. */
export interface ScheduledReceiptRow {
  id: number;
  materialId: number;
  weekStart: string;
  qty: number;
  reference: string | null;
  material?: unknown;
}

export const ScheduledReceiptEntity = new EntitySchema<ScheduledReceiptRow>({
  name: 'ScheduledReceipt',
  tableName: 'scheduled_receipt',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    materialId: { name: 'material_id', type: 'int' },
    weekStart: { name: 'week_start', type: 'date' },
    qty: { type: 'decimal', precision: 14, scale: 4, transformer: decimalAsNumber },
    reference: { type: 'varchar', length: 60, nullable: true },
  },
  relations: {
    material: {
      type: 'many-to-one',
      target: 'Material',
      joinColumn: { name: 'material_id', foreignKeyConstraintName: 'fk_scheduled_receipt_material' },
      onDelete: 'CASCADE',
      onUpdate: 'RESTRICT',
    },
  },
  indices: [{ name: 'ix_scheduled_receipt_material_week', columns: ['materialId', 'weekStart'] }],
});
