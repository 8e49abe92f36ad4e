import ExcelJS from 'exceljs';
import type { DataSource } from 'typeorm';
import type { TestAgent } from '../support/test-app';
import { countRows } from '../support/master-data';

/** Tables an import may write; their row counts must not move when an import is refused. */
export const importedTables = ['product', 'bom_line', 'routing_step', 'work_center', 'material', 'scheduled_receipt', 'firm_order', 'demand_forecast', 'import_run'] as const;

export async function tableCounts(dataSource: DataSource): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const t of importedTables) counts[t] = await countRows(dataSource, t);
  return counts;
}

/** Uploads `content` as the form field `file` to preview (or apply) an import of `kind`. */
export function upload(
  agent: TestAgent,
  kind: string,
  content: string | Buffer,
  fileName: string,
  options: { sheet?: string; headerRow?: number; mapping?: Record<string, string | null>; apply?: boolean } = {},
) {
  let req = agent.post(`/api/imports/${kind}${options.apply ? '/apply' : ''}`);
  if (options.sheet !== undefined) req = req.field('sheet', options.sheet);
  if (options.headerRow !== undefined) req = req.field('headerRow', String(options.headerRow));
  if (options.mapping !== undefined) req = req.field('mapping', JSON.stringify(options.mapping));
  // `filepath` makes the form library send the name as given (it would cut it to its last part).
  return req.attach('file', typeof content === 'string' ? Buffer.from(content, 'utf8') : content, { filename: fileName, filepath: fileName } as never);
}

/** An XLSX workbook written by exceljs: `build` fills it. */
export async function xlsx(build: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  build(wb);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** Every error of a preview as "row N field: message", in row order. */
export function errorLines(preview: { rows: Array<{ rowNumber: number; errors: Array<{ field: string; message: string }> }> }): string[] {
  return preview.rows.flatMap((r) => r.errors.map((e) => `row ${r.rowNumber} ${e.field}: ${e.message}`));
}
