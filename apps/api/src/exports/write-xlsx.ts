import ExcelJS from 'exceljs';
import type { ExportTable } from './export-table';

/** XLSX with one worksheet: a bold, frozen header row; numbers as numbers, everything else as text. */
export async function writeXlsx(table: ExportTable): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Millrace';
  const sheet = workbook.addWorksheet(table.name.slice(0, 31), { views: [{ state: 'frozen', ySplit: 1 }] });
  sheet.addRow(table.columns).font = { bold: true };
  for (const row of table.rows) sheet.addRow(row.map((v) => (v === null ? null : v)));
  sheet.columns.forEach((column, i) => {
    column.width = Math.min(40, Math.max(10, table.columns[i].length + 2));
  });
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
