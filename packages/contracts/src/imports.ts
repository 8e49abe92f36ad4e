import { z } from 'zod';

/**
 * Spreadsheet imports and exports (CSV or XLSX). A file is uploaded to get a preview (columns
 * found, a mapping of columns to our fields, every row with its cell errors); the same file is
 * uploaded again with the mapping to apply it in one transaction. Applied imports are kept with
 * their original file; the latest import of a kind can be undone.
 */

/** What a file holds. `materials` carries stock and lead times; `receipts` the scheduled receipts. */
export const importKindSchema = z.enum(['products', 'work-centers', 'materials', 'receipts', 'bom', 'routings', 'demand']);
export type ImportKind = z.infer<typeof importKindSchema>;

/** Exports: every import kind, plus the results of a solved plan version. */
export const exportKindSchema = z.enum([...importKindSchema.options, 'plan-lines', 'material-calls']);
export type ExportKind = z.infer<typeof exportKindSchema>;

export const fileFormatSchema = z.enum(['csv', 'xlsx']);
export type FileFormat = z.infer<typeof fileFormatSchema>;

/** Largest file accepted (bytes): 10 MB. */
export const importMaxFileBytes = 10 * 1024 * 1024;
/** Most data rows one file may hold; larger files are refused before they are read in full. */
export const importMaxRows = 50_000;

/** Value type of an import field (how a cell is read). */
export const importFieldTypeSchema = z.enum(['code', 'text', 'number', 'integer', 'date', 'boolean', 'choice']);
export type ImportFieldType = z.infer<typeof importFieldTypeSchema>;

export interface ImportFieldDef {
  /** our field name (the key of the mapping) */
  key: string;
  /** the column title our exports write, and the first header recognised */
  label: string;
  type: ImportFieldType;
  /** must be mapped to a column, and filled on every row */
  required: boolean;
  /** needed on rows that create a new record (a file that only updates may leave it out) */
  requiredToCreate?: boolean;
  /** other header texts that mean this field (compared without case, spaces or punctuation) */
  synonyms: readonly string[];
  /** allowed values of a `choice` field */
  choices?: readonly string[];
}

const f = (key: string, label: string, type: ImportFieldType, required: boolean, synonyms: string[], choices?: string[]): ImportFieldDef => ({
  key,
  label,
  type,
  required,
  synonyms,
  ...(choices ? { choices } : {}),
});
/** A field of coded records (products, materials, work centers) needed only to create one. */
const toCreate = (field: ImportFieldDef): ImportFieldDef => ({ ...field, required: false, requiredToCreate: true });

/** The fields of each kind, in the column order of our exports. */
export const importFields: Record<ImportKind, readonly ImportFieldDef[]> = {
  products: [
    f('code', 'code', 'code', true, ['product', 'product code', 'item', 'item code', 'part', 'part number', 'part no', 'sku', 'article', 'artikel', 'artikelnummer']),
    toCreate(f('name', 'name', 'text', true, ['description', 'product name', 'item name', 'bezeichnung', 'designation'])),
    toCreate(f('unit', 'unit', 'text', true, ['uom', 'unit of measure', 'einheit'])),
    toCreate(f('kind', 'kind', 'choice', true, ['type', 'product type', 'product kind'], ['finished', 'subassembly'])),
    f('price', 'price', 'number', false, ['selling price', 'sales price', 'unit price', 'preis']),
    f('holdingCostRatePct', 'holding cost %', 'number', false, ['holding cost rate', 'holding cost rate pct', 'carrying cost %', 'holding %']),
    f('safetyStock', 'safety stock', 'number', false, ['safety', 'buffer stock', 'sicherheitsbestand']),
    f('batchMultiple', 'batch multiple', 'number', false, ['batch', 'batch size', 'multiple', 'lot multiple']),
    f('openingStock', 'opening stock', 'number', false, ['stock', 'on hand', 'inventory', 'bestand']),
    f('latePenalty', 'late penalty', 'number', false, ['backorder cost', 'late cost', 'penalty']),
    f('family', 'family', 'text', false, ['product family', 'changeover family', 'group']),
    f('active', 'active', 'boolean', false, ['is active', 'enabled']),
  ],
  'work-centers': [
    f('code', 'code', 'code', true, ['work center', 'work centre', 'work center code', 'resource', 'machine', 'arbeitsplatz']),
    toCreate(f('name', 'name', 'text', true, ['description', 'work center name', 'bezeichnung'])),
    f('efficiency', 'efficiency', 'number', false, ['eff', 'oee', 'utilisation', 'utilization']),
    f('overtimeCapHoursPerWeek', 'overtime cap hours per week', 'number', false, ['overtime cap', 'max overtime', 'overtime hours']),
    f('overtimeCostPerHour', 'overtime cost per hour', 'number', false, ['overtime cost', 'overtime rate']),
    toCreate(f('shiftsPerDay', 'shifts per day', 'integer', true, ['shifts'])),
    toCreate(f('hoursPerShift', 'hours per shift', 'number', true, ['shift hours', 'shift length'])),
    toCreate(f('daysPerWeek', 'days per week', 'integer', true, ['days', 'working days'])),
    toCreate(f('shiftStarts', 'shift starts', 'text', true, ['shift start', 'start times', 'starts'])),
  ],
  materials: [
    f('code', 'code', 'code', true, ['material', 'material code', 'item', 'item code', 'part', 'part number', 'sku', 'material number']),
    toCreate(f('name', 'name', 'text', true, ['description', 'material name', 'bezeichnung'])),
    toCreate(f('unit', 'unit', 'text', true, ['uom', 'unit of measure', 'einheit'])),
    f('unitCost', 'unit cost', 'number', false, ['cost', 'price', 'purchase price', 'standard cost']),
    f('onHand', 'on hand', 'number', false, ['stock', 'on hand qty', 'inventory', 'quantity on hand', 'bestand']),
    f('leadTimeWeeks', 'lead time weeks', 'integer', false, ['lead time', 'lead time (weeks)', 'lt', 'lt weeks', 'wiederbeschaffungszeit']),
    f('weeklySupplyCap', 'weekly supply cap', 'number', false, ['supply cap', 'max per week']),
    f('lotRule', 'lot rule', 'choice', false, ['lot sizing', 'lot sizing rule', 'order rule'], ['lot_for_lot', 'fixed_order_quantity', 'minimum_order_quantity', 'period_order_quantity']),
    f('lotSize', 'lot size', 'number', false, ['order quantity', 'moq', 'lot qty']),
  ],
  receipts: [
    f('material', 'material', 'code', true, ['material code', 'item', 'item code', 'part', 'part number', 'sku', 'code']),
    f('weekStart', 'week start', 'date', true, ['week', 'due', 'due date', 'receipt date', 'date', 'delivery date', 'week of']),
    f('qty', 'quantity', 'number', true, ['qty', 'receipt qty', 'amount', 'menge']),
    f('unit', 'unit', 'text', false, ['uom', 'unit of measure']),
    f('reference', 'reference', 'text', false, ['ref', 'po', 'purchase order', 'order', 'po number']),
  ],
  bom: [
    f('parent', 'parent', 'code', true, ['parent code', 'parent product', 'assembly', 'product', 'top level', 'finished good', 'parent item']),
    f('component', 'component', 'code', true, ['component code', 'child', 'child code', 'part', 'part number', 'material', 'item', 'komponente']),
    f('qtyPer', 'quantity per', 'number', true, ['qty', 'qty per', 'quantity', 'qty per unit', 'quantity per unit', 'usage', 'menge']),
    f('unit', 'unit', 'text', false, ['uom', 'unit of measure']),
    f('scrapPct', 'scrap %', 'number', false, ['scrap', 'scrap pct', 'scrap percent', 'waste %', 'loss %']),
  ],
  routings: [
    f('product', 'product', 'code', true, ['product code', 'item', 'part', 'part number', 'sku']),
    f('sequence', 'sequence', 'integer', true, ['seq', 'step', 'operation', 'op', 'op no', 'operation number']),
    f('workCenter', 'work center', 'code', true, ['work centre', 'work center code', 'resource', 'machine', 'wc']),
    f('hoursPerUnit', 'hours per unit', 'number', true, ['run hours', 'run time', 'hours', 'time per unit', 'run hours per unit']),
    f('setupHours', 'setup hours', 'number', false, ['setup', 'setup time', 'changeover hours']),
  ],
  /** Without a type column, a row with an order reference is a firm order and one without is a forecast. */
  demand: [
    f('product', 'product', 'code', true, ['product code', 'item', 'item code', 'part', 'part number', 'sku', 'article', 'artikel', 'artikelnummer']),
    f('weekStart', 'week start', 'date', true, ['week', 'date', 'due', 'due date', 'ship date', 'week of', 'period', 'woche', 'datum']),
    f('type', 'type', 'choice', false, ['demand type', 'kind', 'firm or forecast', 'typ', 'art'], ['firm', 'forecast']),
    f('orderRef', 'order reference', 'text', false, ['order', 'order ref', 'customer order', 'so', 'sales order', 'reference', 'auftrag', 'auftragsnummer']),
    f('qty', 'quantity', 'number', true, ['qty', 'amount', 'demand', 'menge']),
    f('unit', 'unit', 'text', false, ['uom', 'unit of measure']),
  ],
};

/** Our field → the column title chosen for it (null: not taken from the file). */
export const importMappingSchema = z.record(z.string(), z.string().max(200).nullable());
export type ImportMapping = z.infer<typeof importMappingSchema>;

/** Options sent with an upload (multipart text fields beside the file). */
export const importOptionsSchema = z.strictObject({
  /** XLSX: the worksheet to read (default: the first one with data) */
  sheet: z.string().max(100).optional(),
  /** 1-based row number of the header row (default: found by its titles) */
  headerRow: z.coerce.number().int('The header row is a whole number.').min(1, 'Rows start at 1.').max(1000, 'The header row must be within the first 1,000 rows.').optional(),
  /** JSON of an ImportMapping (default: the saved mapping of the kind, else the suggested one) */
  mapping: z.string().max(20_000).optional(),
});
export type ImportOptions = z.infer<typeof importOptionsSchema>;

export const importKindParamsSchema = z.strictObject({ kind: importKindSchema });

/** What applying a row does. */
export const importRowOutcomeSchema = z.enum(['create', 'update', 'unchanged', 'error']);
export type ImportRowOutcome = z.infer<typeof importRowOutcomeSchema>;

export const importCellErrorSchema = z.object({ field: z.string(), message: z.string() });
export type ImportCellError = z.infer<typeof importCellErrorSchema>;

export const importPreviewRowSchema = z.object({
  /** row number in the sheet / line number of the record in the file (1-based, as a spreadsheet shows it) */
  rowNumber: z.number().int(),
  /** the cell text per field, as read */
  values: z.record(z.string(), z.string().nullable()),
  errors: z.array(importCellErrorSchema),
  outcome: importRowOutcomeSchema,
});
export type ImportPreviewRow = z.infer<typeof importPreviewRowSchema>;

export const importSummarySchema = z.object({
  created: z.number().int(),
  updated: z.number().int(),
  unchanged: z.number().int(),
  /** lines dropped from lists the file replaces (a parent's BOM, a product's routing, a material's receipts) */
  removed: z.number().int(),
});
export type ImportSummary = z.infer<typeof importSummarySchema>;

export const mappingSourceSchema = z.enum(['sent', 'saved', 'suggested']);
export type MappingSource = z.infer<typeof mappingSourceSchema>;

/** Answer of POST /api/imports/:kind (the preview). */
export const importPreviewSchema = z.object({
  kind: importKindSchema,
  fileName: z.string(),
  format: fileFormatSchema,
  /** XLSX: every worksheet name; CSV: empty */
  sheets: z.array(z.string()),
  sheet: z.string().nullable(),
  /** CSV only: the delimiter found */
  delimiter: z.string().nullable(),
  headerRow: z.number().int(),
  columns: z.array(z.string()),
  mapping: importMappingSchema,
  mappingSource: mappingSourceSchema,
  /** the mapping the headers alone suggest (for "reset to suggested") */
  suggestedMapping: importMappingSchema,
  rows: z.array(importPreviewRowSchema),
  /** problems of the whole file or mapping (a required field not mapped, …) */
  fileErrors: z.array(z.string()),
  counts: z.object({ rows: z.number().int(), errorRows: z.number().int() }),
  /** what applying would do (only meaningful without errors) */
  summary: importSummarySchema,
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;

export const importRunStateSchema = z.enum(['applied', 'undone']);
export type ImportRunState = z.infer<typeof importRunStateSchema>;

/** One applied import (history). */
export const importRunSchema = z.object({
  id: z.number().int(),
  kind: importKindSchema,
  fileName: z.string(),
  format: fileFormatSchema,
  fileBytes: z.number().int(),
  sheet: z.string().nullable(),
  rows: z.number().int(),
  summary: importSummarySchema,
  state: importRunStateSchema,
  appliedBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  appliedAt: z.string(),
  undoneBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  undoneAt: z.string().nullable(),
  /** true for the latest applied import of its kind (the one undo would restore) */
  undoable: z.boolean(),
});
export type ImportRun = z.infer<typeof importRunSchema>;

export const importHistoryQuerySchema = z.strictObject({ kind: importKindSchema.optional() });
export const importRunParamsSchema = z.strictObject({ id: z.coerce.number().int().positive('The import id must be a positive whole number.') });

/** Body of PUT /api/imports/:kind/mapping. */
export const importMappingSaveSchema = z.strictObject({ mapping: importMappingSchema });
export type ImportMappingSave = z.infer<typeof importMappingSaveSchema>;

/** Answer of GET/PUT /api/imports/:kind/mapping. */
export const savedMappingSchema = z.object({ kind: importKindSchema, mapping: importMappingSchema.nullable(), updatedAt: z.string().nullable() });
export type SavedMapping = z.infer<typeof savedMappingSchema>;

/** Query of GET /api/exports/:kind. */
export const exportQuerySchema = z.strictObject({
  format: fileFormatSchema.default('csv'),
  /** plan-lines and material-calls: the plan version */
  plan: z.coerce.number().int().positive('The plan id must be a positive whole number.').optional(),
});
export const exportKindParamsSchema = z.strictObject({ kind: exportKindSchema });
