import { importFields, materialCreateSchema, type Material, type MaterialCreate } from '@millrace/contracts';
import { deleteMaterialRow, insertMaterial, listAllMaterials, updateMaterialIfVersion } from '../../materials/materials.repository';
import { recordKind, type Flat, type StoredRecord } from './record-kind';

const keys = importFields.materials.map((f) => f.key);

export function materialFlat(m: Material): Flat {
  return Object.fromEntries(keys.map((k) => [k, m[k as keyof Material]]));
}

/** Materials by code (stock on hand, lead times, lot rules): create new codes, update known ones. */
export const materialsImport = recordKind<MaterialCreate>(
  {
    kind: 'materials',
    what: 'material',
    async loadAll(db): Promise<StoredRecord[]> {
      return (await listAllMaterials(db)).map((m) => ({ id: m.id, code: m.code, version: m.version, flat: materialFlat(m) }));
    },
    schema: materialCreateSchema,
    toInput: (flat) => flat,
    fromInput: (input) => ({ ...input }),
    insert: (db, input) => insertMaterial(db, input),
    update: (db, id, version, changes) => updateMaterialIfVersion(db, id, { ...changes, version }),
    remove: (db, id) => deleteMaterialRow(db, id),
    nullable: ['weeklySupplyCap', 'lotSize'],
  },
  importFields.materials,
);
