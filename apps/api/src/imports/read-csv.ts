import Papa from 'papaparse';
import { importLimits } from './import-limits';
import type { SpreadsheetFile } from './spreadsheet-grid';
import { tooLarge, unreadableFile } from './unreadable-file';

/** Delimiters tried, in order of preference when several split the file evenly (a `;` file often has decimal commas). */
const delimiters = ['\t', ';', ',', '|'] as const;
const delimiterNames: Record<string, string> = { '\t': 'tab', ';': 'semicolon', ',': 'comma', '|': 'vertical bar' };
/** Records looked at to choose the delimiter. */
const sniffRecords = 50;

/**
 * Decodes the bytes as text: UTF-8 (a byte-order mark is dropped), else Windows-1252 (older
 * spreadsheet exports). Bytes that are no text at all (control characters, NUL) are refused.
 */
export function decodeText(bytes: Buffer): string {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    text = new TextDecoder('windows-1252').decode(bytes);
  }
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u0008\u000b\u000e-\u001f\u007f]/.test(text)) {
    throw unreadableFile('The file is neither a CSV text file nor an XLSX workbook: it holds binary data. Save it from your spreadsheet program as CSV or XLSX.');
  }
  return text;
}

function fieldCounts(text: string, delimiter: string): number[] {
  const counts: number[] = [];
  Papa.parse<string[]>(text, {
    delimiter,
    preview: sniffRecords,
    skipEmptyLines: 'greedy',
    step: (r) => {
      counts.push(r.data.length);
    },
  });
  return counts;
}

/** The delimiter that splits every sampled record into the same number (> 1) of fields. */
export function chooseDelimiter(text: string): string {
  let widest: { delimiter: string; fields: number } = { delimiter: ',', fields: 1 };
  for (const delimiter of delimiters) {
    const counts = fieldCounts(text, delimiter);
    if (counts.length === 0) continue;
    if (counts[0] > 1 && counts.every((c) => c === counts[0])) return delimiter;
    if (counts[0] > widest.fields) widest = { delimiter, fields: counts[0] };
  }
  return widest.delimiter;
}

/**
 * Reads a CSV file: comma, semicolon, tab or vertical-bar delimited, quoted fields with
 * delimiters and line breaks inside, UTF-8 with or without a byte-order mark. Records are
 * counted first without keeping them, so a file over the row limit is refused before it is
 * read in full. Empty records are skipped (their numbers are kept for the others).
 */
export function readCsv(bytes: Buffer): SpreadsheetFile {
  const text = decodeText(bytes);
  if (text.trim() === '') throw unreadableFile('The file is empty.');
  const delimiter = chooseDelimiter(text);

  let records = 0;
  let widest = 0;
  Papa.parse<string[]>(text, {
    delimiter,
    skipEmptyLines: 'greedy',
    step: (r, parser) => {
      records += 1;
      widest = Math.max(widest, r.data.length);
      if (records > importLimits.maxRows + importLimits.headerSearchRows) parser.abort();
    },
  });
  if (records > importLimits.maxRows + importLimits.headerSearchRows) {
    throw tooLarge(`The file has more than ${importLimits.maxRows.toLocaleString('en')} rows; an import takes at most ${importLimits.maxRows.toLocaleString('en')}. Split it into several files.`);
  }
  if (widest > importLimits.maxColumns) {
    throw tooLarge(`The file has ${widest} columns; an import takes at most ${importLimits.maxColumns}.`);
  }

  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false });
  const rows: string[][] = [];
  const rowNumbers: number[] = [];
  parsed.data.forEach((record, i) => {
    if (record.every((c) => c.trim() === '')) return;
    rows.push(record);
    rowNumbers.push(i + 1);
  });
  const broken = parsed.errors.find((e) => e.code === 'MissingQuotes');
  if (broken) {
    throw unreadableFile(`Row ${(broken.row ?? 0) + 1} opens a quoted field that is never closed; check the quotation marks in the file.`);
  }
  return { format: 'csv', sheetNames: [], sheet: null, delimiter, grid: { rows, rowNumbers } };
}

export function delimiterName(delimiter: string): string {
  return delimiterNames[delimiter] ?? delimiter;
}
