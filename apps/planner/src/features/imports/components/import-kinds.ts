import type { ImportKind } from '@millrace/contracts';

/** Words for each kind of file, as the planner calls them. */
export const importKindLabels: Record<ImportKind, string> = {
  products: 'Products',
  'work-centers': 'Work centers',
  materials: 'Materials',
  receipts: 'Scheduled receipts',
  bom: 'Bills of materials',
  routings: 'Routings',
  demand: 'Demand',
};
