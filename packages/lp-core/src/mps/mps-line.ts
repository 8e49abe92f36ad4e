/**
 * Splitting one MPS data line into fields.
 *
 * Free format: fields are separated by white space (names cannot contain blanks).
 * Fixed format (the original layout, 1-based character columns):
 *
 *   field 1: 2–3   field 2: 5–12   field 3: 15–22   field 4: 25–36   field 5: 40–47   field 6: 50–61
 *
 * Names may then contain blanks. We read fields 4 and 6 up to the next field (and to the line end),
 * since many writers let long numbers spill over the nominal width.
 */
export type MpsFormat = 'fixed' | 'free';

/** Fixed-format fields 1–6, blank-trimmed ('' when absent). */
export function fixedFields(line: string): string[] {
  const cut = (from: number, to: number) => (line.length > from ? line.slice(from, to).trim() : '');
  return [cut(1, 3), cut(4, 12), cut(14, 22), cut(24, 39), cut(39, 47), cut(49, line.length)];
}

export function freeTokens(line: string): string[] {
  const trimmed = line.trim();
  return trimmed === '' ? [] : trimmed.split(/\s+/);
}

/** A header line starts in column 1; data lines start with a blank. */
export function isHeaderLine(line: string): boolean {
  return line.length > 0 && line[0] !== ' ' && line[0] !== '\t';
}

/** Comment lines start with '*'; blank lines carry nothing. */
export function isSkippedLine(line: string): boolean {
  return line.trim() === '' || line[0] === '*';
}

/** Values at or beyond this magnitude mean "no bound" (common practice, no source: many files use 1e30). */
export const MPS_INFINITY = 1e30;

/** Parses an MPS number (also Fortran-style 1.0D+02 and Inf/Infinity); NaN when it is not a number. */
export function parseMpsNumber(token: string): number {
  if (/^[+-]?inf(inity)?$/i.test(token)) return token.startsWith('-') ? -Infinity : Infinity;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eEdD][+-]?\d+)?$/.test(token)) return NaN;
  const value = Number(token.replace(/[dD]/, 'e'));
  if (value >= MPS_INFINITY) return Infinity;
  if (value <= -MPS_INFINITY) return -Infinity;
  return value;
}
