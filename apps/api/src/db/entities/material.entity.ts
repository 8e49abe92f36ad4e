import { EntitySchema } from 'typeorm';
import type { LotRule } from '@millrace/contracts';
import { decimalAsNumber } from './column-types';

/** A purchased material. Table `material`. */
export interface MaterialRow {
  id: number;
  code: string;
  name: string;
  unit: string;
  unitCost: number;
  onHand: number;
  leadTimeWeeks: number;
  weeklySupplyCap: number | null;
  lotRule: LotRule;
  lotSize: number | null;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

export const MaterialEntity = new EntitySchema<MaterialRow>({
  name: 'Material',
  tableName: 'material',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    code: { type: 'varchar', length: 40 },
    name: { type: 'varchar', length: 120 },
    unit: { type: 'varchar', length: 16 },
    unitCost: { name: 'unit_cost', type: 'decimal', precision: 14, scale: 4, transformer: decimalAsNumber },
    onHand: { name: 'on_hand', type: 'decimal', precision: 14, scale: 4, transformer: decimalAsNumber },
    leadTimeWeeks: { name: 'lead_time_weeks', type: 'smallint' },
    weeklySupplyCap: { name: 'weekly_supply_cap', type: 'decimal', precision: 14, scale: 4, nullable: true, transformer: decimalAsNumber },
    lotRule: { name: 'lot_rule', type: 'varchar', length: 24 },
    lotSize: { name: 'lot_size', type: 'decimal', precision: 14, scale: 4, nullable: true, transformer: decimalAsNumber },
    version: { type: 'int', default: 1 },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
  indices: [
    { name: 'uq_material_code', columns: ['code'], unique: true },
    { name: 'ix_material_name', columns: ['name'] },
  ],
});
