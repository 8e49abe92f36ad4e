import type { ImportKind } from '@millrace/contracts';
import { bomImport } from './bom.import';
import { demandImport } from './demand.import';
import type { ImportKindHandler } from './import-kind';
import { materialsImport } from './materials.import';
import { productsImport } from './products.import';
import { receiptsImport } from './receipts.import';
import { routingsImport } from './routings.import';
import { workCentersImport } from './work-centers.import';

/** The handler of each kind of import. */
export const importKinds: Record<ImportKind, ImportKindHandler> = {
  products: productsImport,
  'work-centers': workCentersImport,
  materials: materialsImport,
  receipts: receiptsImport,
  bom: bomImport,
  routings: routingsImport,
  demand: demandImport,
};
