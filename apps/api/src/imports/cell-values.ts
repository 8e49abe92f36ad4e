import type { ImportFieldDef } from '@millrace/contracts';
import { cellText, isBlank, type RawCell } from './spreadsheet-grid';

/** A cell read as one field: its value, or the message saying what is wrong with it. */
export type CellReading = { outcome: 'value'; value: string | number | boolean } | { outcome: 'empty' } | { outcome: 'invalid'; message: string };

/**
 * Reads a number written the way spreadsheets and people write them: `1234.5`, `1234,5`
 * (decimal comma), `1.234,5`, `1,234.5`, `1 234,5`, `1'234.5`. With both separators the last
 * one is the decimal mark; a single comma is a decimal comma; several commas group thousands.
 */
export function parseDecimal(text: string): number | null {
  let s = text.trim().replace(/[\s\u00a0\u202f']/g, '');
  if (s === '') return null;
  const negative = /^-|^\(.*\)$/.test(s);
  s = s.replace(/^[-+]|^\(|\)$/g, '');
  const lastDot = s.lastIndexOf('.');
  const lastComma = s.lastIndexOf(',');
  if (lastDot >= 0 && lastComma >= 0) {
    const decimal = lastDot > lastComma ? '.' : ',';
    const group = decimal === '.' ? ',' : '.';
    s = s.split(group).join('').replace(decimal, '.');
  } else if (lastComma >= 0) {
    s = (s.match(/,/g) ?? []).length === 1 ? s.replace(',', '.') : s.split(',').join('');
  } else if ((s.match(/\./g) ?? []).length > 1) {
    s = s.split('.').join('');
  }
  if (!/^(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(s)) return null;
  const n = Number(s);
  if (!Number.isFinite(n)) return null;
  return negative ? -n : n;
}

const isoPattern = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[T ].*)?$/;
const slashIsoPattern = /^(\d{4})\/(\d{1,2})\/(\d{1,2})$/;
const dottedPattern = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/;
const slashPattern = /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/;

function isoDate(y: number, m: number, d: number): string | null {
  const date = new Date(Date.UTC(y, m - 1, d));
  if (date.getUTCFullYear() !== y || date.getUTCMonth() !== m - 1 || date.getUTCDate() !== d) return null;
  return date.toISOString().slice(0, 10);
}

/** Spreadsheet serial day numbers (1900 date system: day 0 = 1899-12-30 once the 1900 leap-year quirk is counted), for years 1950–2199. */
export function serialToIso(serial: number): string | null {
  if (!Number.isFinite(serial) || serial < 18264 || serial > 109574) return null;
  const ms = Date.UTC(1899, 11, 30) + Math.floor(serial) * 86_400_000;
  return new Date(ms).toISOString().slice(0, 10);
}

/**
 * Reads a date: a spreadsheet date, a serial day number, `YYYY-MM-DD`, `YYYY/MM/DD`,
 * `DD.MM.YYYY`, or `DD/MM/YYYY` / `MM/DD/YYYY` when only one reading is a real date.
 */
export function parseDate(cell: RawCell): { date: string } | { message: string } {
  if (cell instanceof Date) {
    if (Number.isNaN(cell.getTime())) return { message: 'This date cannot be read.' };
    return { date: cell.toISOString().slice(0, 10) };
  }
  if (typeof cell === 'number') {
    const iso = serialToIso(cell);
    return iso ? { date: iso } : { message: `${cell} is not a date; write it as YYYY-MM-DD.` };
  }
  const text = String(cellText(cell) ?? '').trim();
  let m = isoPattern.exec(text) ?? slashIsoPattern.exec(text);
  if (m) {
    const iso = isoDate(Number(m[1]), Number(m[2]), Number(m[3]));
    return iso ? { date: iso } : { message: `${text} is not a real date.` };
  }
  if ((m = dottedPattern.exec(text))) {
    const iso = isoDate(Number(m[3]), Number(m[2]), Number(m[1]));
    return iso ? { date: iso } : { message: `${text} is not a real date.` };
  }
  if ((m = slashPattern.exec(text))) {
    const dayFirst = isoDate(Number(m[3]), Number(m[2]), Number(m[1]));
    const monthFirst = isoDate(Number(m[3]), Number(m[1]), Number(m[2]));
    if (dayFirst && monthFirst && dayFirst !== monthFirst) return { message: `${text} can be read day-first or month-first; write it as YYYY-MM-DD.` };
    const iso = dayFirst ?? monthFirst;
    return iso ? { date: iso } : { message: `${text} is not a real date.` };
  }
  if (/^\d{5}(\.\d+)?$/.test(text)) {
    const iso = serialToIso(Number(text));
    if (iso) return { date: iso };
  }
  return { message: `${text} is not a date; write it as YYYY-MM-DD.` };
}

const truthy = new Set(['yes', 'y', 'true', '1', 'x', 'ja', 'active', 'wahr']);
const falsy = new Set(['no', 'n', 'false', '0', 'nein', 'inactive', 'falsch']);

/** Other ways files spell our choices (compared without case, spaces or punctuation). */
const choiceAliases: Record<string, string> = {
  finishedgood: 'finished',
  finishedgoods: 'finished',
  fg: 'finished',
  endproduct: 'finished',
  subassemblies: 'subassembly',
  semifinished: 'subassembly',
  intermediate: 'subassembly',
  lfl: 'lot_for_lot',
  lotforlot: 'lot_for_lot',
  foq: 'fixed_order_quantity',
  fixed: 'fixed_order_quantity',
  moq: 'minimum_order_quantity',
  minimum: 'minimum_order_quantity',
  poq: 'period_order_quantity',
  period: 'period_order_quantity',
  firmorder: 'firm',
  order: 'firm',
  fc: 'forecast',
  fcst: 'forecast',
};

const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

function label(field: ImportFieldDef): string {
  return field.label;
}

/** Reads one cell as the field's type. Required-ness is checked by the caller. */
export function readCell(field: ImportFieldDef, cell: RawCell): CellReading {
  if (isBlank(cell)) return { outcome: 'empty' };
  if (typeof cell === 'object' && cell !== null && !(cell instanceof Date)) {
    return { outcome: 'invalid', message: `The spreadsheet shows ${cell.error} here instead of a value.` };
  }
  const text = String(cellText(cell)).trim();
  switch (field.type) {
    case 'code':
    case 'text':
      if (cell instanceof Date) return { outcome: 'invalid', message: `Expected text for ${label(field)}, found the date ${text}.` };
      // An apostrophe that guards a formula-like text (our CSV exports write one) is not part of it.
      return { outcome: 'value', value: /^'[=+\-@]/.test(text) ? text.slice(1) : text };
    case 'number':
    case 'integer': {
      if (cell instanceof Date || typeof cell === 'boolean') return { outcome: 'invalid', message: `${text} is not a number.` };
      const n = typeof cell === 'number' ? cell : parseDecimal(text);
      if (n === null) return { outcome: 'invalid', message: `${text} is not a number.` };
      if (field.type === 'integer' && !Number.isInteger(n)) return { outcome: 'invalid', message: `${text} is not a whole number.` };
      return { outcome: 'value', value: n };
    }
    case 'date': {
      const d = parseDate(cell);
      return 'date' in d ? { outcome: 'value', value: d.date } : { outcome: 'invalid', message: d.message };
    }
    case 'boolean': {
      if (typeof cell === 'boolean') return { outcome: 'value', value: cell };
      const t = text.toLowerCase();
      if (truthy.has(t)) return { outcome: 'value', value: true };
      if (falsy.has(t)) return { outcome: 'value', value: false };
      return { outcome: 'invalid', message: `${text} is not yes or no.` };
    }
    case 'choice': {
      const choices = field.choices ?? [];
      const wanted = squash(text);
      const found = choices.find((c) => squash(c) === wanted) ?? (choiceAliases[wanted] && choices.includes(choiceAliases[wanted]) ? choiceAliases[wanted] : undefined);
      if (!found) return { outcome: 'invalid', message: `${text} is not one of ${choices.join(', ')}.` };
      return { outcome: 'value', value: found };
    }
  }
}
