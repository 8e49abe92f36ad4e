import type { ImportFieldDef, ImportMapping } from '@millrace/contracts';
import { importLimits } from './import-limits';
import { cellText, isBlank, type RawCell, type SheetGrid } from './spreadsheet-grid';

/** Header text compared without case, spaces, punctuation or accents. */
export function squashHeader(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9%]/g, '')
    .replace(/%/g, 'pct');
}

function columnLetter(index: number): string {
  let n = index + 1;
  let s = '';
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/**
 * Column titles from the header row: blank titles become "column C"; a title merged across
 * several columns, or repeated, gets "(2)", "(3)" on the later columns so every title is unique.
 */
export function columnTitles(header: RawCell[], mergedContinuations: Set<number>): string[] {
  const seen = new Map<string, number>();
  let lastTitle = '';
  return header.map((cell, i) => {
    let title = isBlank(cell) ? '' : String(cellText(cell)).replace(/\s+/g, ' ').trim();
    if (mergedContinuations.has(i) && lastTitle) title = lastTitle;
    if (!title) title = `column ${columnLetter(i)}`;
    lastTitle = title;
    const count = (seen.get(title.toLowerCase()) ?? 0) + 1;
    seen.set(title.toLowerCase(), count);
    return count === 1 ? title : `${title} (${count})`;
  });
}

function namesOf(field: ImportFieldDef): Set<string> {
  return new Set([field.label, field.key, ...field.synonyms].map(squashHeader));
}

/** How many cells of a row are titles of our fields. */
function titleScore(row: RawCell[], fields: readonly ImportFieldDef[]): number {
  const names = new Set(fields.flatMap((f) => [...namesOf(f)]));
  return row.filter((c) => !isBlank(c) && typeof c !== 'number' && names.has(squashHeader(String(cellText(c))))).length;
}

/**
 * The header row (index into the grid's rows): among the first rows, the one with most cells
 * that name our fields; a title line or an empty line above the table is skipped that way.
 */
export function findHeaderRow(grid: SheetGrid, fields: readonly ImportFieldDef[]): number {
  let best = { index: 0, score: 0 };
  const limit = Math.min(grid.rows.length, importLimits.headerSearchRows);
  for (let i = 0; i < limit; i += 1) {
    const score = titleScore(grid.rows[i], fields);
    if (score > best.score) best = { index: i, score };
  }
  if (best.score > 0) return best.index;
  const firstTable = grid.rows.slice(0, limit).findIndex((r) => r.filter((c) => !isBlank(c)).length >= 2);
  return firstTable >= 0 ? firstTable : 0;
}

/** The mapping the titles suggest: our own titles first, then other usual names; each column used once. */
export function suggestMapping(columns: string[], fields: readonly ImportFieldDef[]): ImportMapping {
  const squashed = columns.map(squashHeader);
  const mapping: ImportMapping = Object.fromEntries(fields.map((f) => [f.key, null]));
  const used = new Set<number>();
  const take = (field: ImportFieldDef, names: string[]) => {
    if (mapping[field.key] !== null) return;
    for (const name of names) {
      const i = squashed.findIndex((s, j) => s === name && !used.has(j));
      if (i >= 0) {
        mapping[field.key] = columns[i];
        used.add(i);
        return;
      }
    }
  };
  for (const field of fields) take(field, [squashHeader(field.label), squashHeader(field.key)]);
  for (const field of fields) take(field, field.synonyms.map(squashHeader));
  return mapping;
}

/**
 * The mapping used: what was sent, else the saved one (for the columns this file has, the rest
 * suggested), else the suggestion. Returns the problems of a sent or saved mapping too.
 */
export function resolveMapping(
  fields: readonly ImportFieldDef[],
  columns: string[],
  sent: ImportMapping | null,
  saved: ImportMapping | null,
): { mapping: ImportMapping; source: 'sent' | 'saved' | 'suggested'; suggested: ImportMapping; problems: string[] } {
  const suggested = suggestMapping(columns, fields);
  const problems: string[] = [];
  if (sent) {
    const keys = new Set(fields.map((f) => f.key));
    for (const key of Object.keys(sent)) if (!keys.has(key)) problems.push(`The mapping names a field "${key}" that this kind of file does not have.`);
    const mapping: ImportMapping = Object.fromEntries(fields.map((f) => [f.key, sent[f.key] ?? null]));
    for (const f of fields) {
      const column = mapping[f.key];
      if (column !== null && !columns.includes(column)) {
        problems.push(`The column "${column}" chosen for ${f.label} is not in the file.`);
        mapping[f.key] = null;
      }
    }
    return { mapping, source: 'sent', suggested, problems };
  }
  if (saved) {
    const usable = fields.some((f) => saved[f.key] && columns.includes(saved[f.key]!));
    if (usable) {
      const mapping: ImportMapping = Object.fromEntries(
        fields.map((f) => {
          const column = saved[f.key];
          return [f.key, column && columns.includes(column) ? column : null];
        }),
      );
      const taken = new Set(Object.values(mapping).filter((c): c is string => c !== null));
      for (const f of fields) {
        if (mapping[f.key] === null && suggested[f.key] && !taken.has(suggested[f.key]!)) mapping[f.key] = suggested[f.key];
      }
      return { mapping, source: 'saved', suggested, problems };
    }
  }
  return { mapping: suggested, source: 'suggested', suggested, problems };
}

/** Problems of a mapping as a whole: required fields without a column, a column used twice. */
export function mappingProblems(fields: readonly ImportFieldDef[], mapping: ImportMapping): string[] {
  const problems: string[] = [];
  for (const f of fields) if (f.required && !mapping[f.key]) problems.push(`Choose the column that holds ${f.label} (it is required).`);
  const byColumn = new Map<string, string[]>();
  for (const f of fields) {
    const c = mapping[f.key];
    if (c) byColumn.set(c, [...(byColumn.get(c) ?? []), f.label]);
  }
  for (const [column, labels] of byColumn) if (labels.length > 1) problems.push(`The column "${column}" is chosen for both ${labels.join(' and ')}; choose one column per field.`);
  return problems;
}
