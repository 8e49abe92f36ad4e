import { EntitySchema } from 'typeorm';
import type { ImportKind } from '@millrace/contracts';

/** The column mapping saved for one kind of import. Table `import_mapping`. */
export interface ImportMappingRow {
  kind: ImportKind;
  /** JSON of the mapping */
  mapping: string;
  updatedBy: number | null;
  updatedAt: Date;
}

export const ImportMappingEntity = new EntitySchema<ImportMappingRow>({
  name: 'ImportMapping',
  tableName: 'import_mapping',
  columns: {
    kind: { type: 'varchar', length: 20, primary: true },
    mapping: { type: 'text' },
    updatedBy: { name: 'updated_by', type: 'int', nullable: true },
    updatedAt: { name: 'updated_at', type: 'datetime', precision: 3 },
  },
});
