import { EntitySchema } from 'typeorm';

/** A named set of what-if overrides on the plant's data. Table `scenario`; overrides as JSON text. */
export interface ScenarioRow {
  id: number;
  name: string;
  description: string;
  overrides: string;
  version: number;
  createdBy: number | null;
  createdAt: Date;
  updatedAt: Date;
}

export const ScenarioEntity = new EntitySchema<ScenarioRow>({
  name: 'Scenario',
  tableName: 'scenario',
  columns: {
    id: { type: 'int', primary: true, generated: 'increment' },
    name: { type: 'varchar', length: 120, unique: true },
    description: { type: 'text' },
    overrides: { type: 'longtext' },
    version: { type: 'int', default: 1 },
    createdBy: { name: 'created_by', type: 'int', nullable: true },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
});
