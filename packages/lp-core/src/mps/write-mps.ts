/**
 * MPS writer. The output reads back (readMps) into the same problem: same names, order, bounds,
 * objective (with c₀ as minus the objective-row RHS, and OBJSENSE MAX when the problem maximises),
 * integer markers and Q (as QUADOBJ, lower triangle).
 *
 * Layout: fixed format when every name fits 8 characters (inner blanks allowed) and every number fits
 * 12 characters; free format otherwise (names must then be free of blanks). Numbers are written in
 * JavaScript's shortest round-trip form, so values survive exactly. Row encodings:
 *   l = u → E;  only u finite → L;  only l finite → G;  both finite → G with RANGES u − l;
 *   both infinite → G with RHS −1e30 (read back as no bound).
 */
import type { Problem } from '../problem/problem';

const NAME_WIDTH = 8;
const NUMBER_WIDTH = 12;

export function writeMps(problem: Problem): string {
  assertUniqueNames(problem.rowNames, 'row');
  assertUniqueNames(problem.colNames, 'column');
  const w = new MpsWriter();
  const objName = objectiveRowName(problem.rowNames);
  const sign = problem.maximise ? -1 : 1;

  w.header(`NAME          ${problem.name ?? ''}`.trimEnd());
  if (problem.maximise) {
    w.header('OBJSENSE');
    w.line('', 'MAX');
  }
  w.header('ROWS');
  w.line('N', objName);
  const rowKinds = problem.rowNames.map((name, i) => rowEncoding(problem.rowLower[i], problem.rowUpper[i]));
  problem.rowNames.forEach((name, i) => w.line(rowKinds[i].type, name));

  w.header('COLUMNS');
  writeColumns(w, problem, objName, sign);

  w.header('RHS');
  const fileC0 = sign * problem.c0;
  if (fileC0 !== 0) w.pairs('RHS', [[objName, -fileC0]]);
  w.pairs('RHS', rowKinds.flatMap((k, i) => (k.rhs !== 0 ? [[problem.rowNames[i], k.rhs] as [string, number]] : [])));

  const ranges = rowKinds.flatMap((k, i) => (k.range !== undefined ? [[problem.rowNames[i], k.range] as [string, number]] : []));
  if (ranges.length > 0) {
    w.header('RANGES');
    w.pairs('RNG', ranges);
  }
  writeBounds(w, problem);
  if (problem.Q && problem.Q.colPtr[problem.Q.n] > 0) writeQuadobj(w, problem, sign);
  w.header('ENDATA');
  return w.text();
}

/**
 * Collects header lines and data-line fields; picks fixed or free layout once everything is known.
 * Fields live in one flat array (a line is a header when its field count is 0), so writing a
 * model of a few hundred thousand entries does not allocate an array per line.
 */
class MpsWriter {
  private readonly fields: string[] = [];
  /** per line: [first field, field count]; count 0 = a header whose text is fields[first] */
  private readonly starts: number[] = [];
  private fitsFixed = true;

  header(text: string): void {
    this.starts.push(this.fields.length, 0);
    this.fields.push(text);
  }

  /** fields 1–6 of a data line (field 1 = type code, field 2 = first name, …) */
  line(...values: (string | number)[]): void {
    this.starts.push(this.fields.length, values.length);
    for (let k = 0; k < values.length; k++) {
      const v = values[k];
      const f = typeof v === 'number' ? formatNumber(v) : v;
      if (this.fitsFixed && !fitsFixedField(f, k)) this.fitsFixed = false;
      this.fields.push(f);
    }
  }

  /** (name, value) pairs, two per line, under a vector name (RHS, RANGES). */
  pairs(setName: string, pairs: [string, number][]): void {
    for (let k = 0; k < pairs.length; k += 2) {
      const second = pairs[k + 1];
      if (second) this.line('', setName, pairs[k][0], pairs[k][1], second[0], second[1]);
      else this.line('', setName, pairs[k][0], pairs[k][1]);
    }
  }

  text(): string {
    const { fields, starts } = this;
    const out: string[] = new Array(starts.length / 2);
    for (let l = 0; l < starts.length; l += 2) {
      const first = starts[l];
      const count = starts[l + 1];
      out[l / 2] = count === 0 ? fields[first] : this.fitsFixed ? fixedLine(fields, first, count) : freeLine(fields, first, count);
    }
    return out.join('\n') + '\n';
  }
}

const FIELD_WIDTHS = [2, NAME_WIDTH, NAME_WIDTH, NUMBER_WIDTH, NAME_WIDTH, NUMBER_WIDTH];
const FIELD_GAPS = [' ', ' ', '  ', '  ', '   ', '  '];
const BLANK = /\s/;

function fitsFixedField(f: string, k: number): boolean {
  if (f.length > FIELD_WIDTHS[k]) return false;
  return f.length === 0 || (!BLANK.test(f[0]) && !BLANK.test(f[f.length - 1]));
}

function fixedLine(fields: string[], first: number, count: number): string {
  let text = '';
  for (let k = 0; k < count; k++) {
    const v = fields[first + k];
    text += FIELD_GAPS[k] + (k === 3 || k === 5 ? v.padStart(FIELD_WIDTHS[k]) : v.padEnd(FIELD_WIDTHS[k]));
  }
  return text.trimEnd();
}

function freeLine(fields: string[], first: number, count: number): string {
  const code = fields[first];
  let text = code === '' ? '    ' : ` ${code.padEnd(2)} `;
  let any = false;
  for (let k = 1; k < count; k++) {
    const v = fields[first + k];
    if (v === '') continue;
    if (BLANK.test(v)) throw new Error(`writeMps: name '${v}' contains blanks and is too long for the fixed layout`);
    text += any ? '  ' + v : v;
    any = true;
  }
  return text;
}

function writeColumns(w: MpsWriter, problem: Problem, objName: string, sign: number): void {
  const { A, c, colNames, rowNames } = problem;
  const integer = new Set(problem.integerCols ?? []);
  let inMarker = false;
  let markers = 0;
  for (let j = 0; j < A.n; j++) {
    if (integer.has(j) !== inMarker) {
      inMarker = !inMarker;
      w.line('', `MARKER${inMarker ? markers++ : ''}`.slice(0, NAME_WIDTH), "'MARKER'", '', inMarker ? "'INTORG'" : "'INTEND'");
    }
    // (row, value) entries of column j, two per line: the objective first when it is nonzero or the column is empty
    const p1 = A.colPtr[j + 1];
    let p = A.colPtr[j];
    if (c[j] !== 0 || p === p1) {
      if (p < p1) w.line('', colNames[j], objName, sign * c[j] + 0, rowNames[A.rowIdx[p]], A.values[p++]);
      else w.line('', colNames[j], objName, sign * c[j] + 0);
    }
    for (; p + 1 < p1; p += 2) w.line('', colNames[j], rowNames[A.rowIdx[p]], A.values[p], rowNames[A.rowIdx[p + 1]], A.values[p + 1]);
    if (p < p1) w.line('', colNames[j], rowNames[A.rowIdx[p]], A.values[p]);
  }
  if (inMarker) w.line('', 'MARKEND', "'MARKER'", '', "'INTEND'");
}

function writeBounds(w: MpsWriter, problem: Problem): void {
  const lines: (string | number)[][] = [];
  for (let j = 0; j < problem.colNames.length; j++) {
    const l = problem.colLower[j];
    const u = problem.colUpper[j];
    const name = problem.colNames[j];
    if (l === 0 && u === Infinity) continue;
    if (l === u) lines.push(['FX', 'BND', name, l]);
    else if (l === -Infinity && u === Infinity) lines.push(['FR', 'BND', name]);
    else if (l === -Infinity) lines.push(['MI', 'BND', name], ['UP', 'BND', name, u]);
    else {
      // UP before LO: a negative UP on a zero lower bound is read as "lower = −∞", LO then restores it.
      if (u !== Infinity) lines.push(['UP', 'BND', name, u]);
      if (l !== 0 || u < 0) lines.push(['LO', 'BND', name, l]);
    }
  }
  if (lines.length === 0) return;
  w.header('BOUNDS');
  for (const line of lines) w.line(...line);
}

function writeQuadobj(w: MpsWriter, problem: Problem, sign: number): void {
  const Q = problem.Q!;
  w.header('QUADOBJ');
  for (let j = 0; j < Q.n; j++) {
    for (let p = Q.colPtr[j]; p < Q.colPtr[j + 1]; p++) {
      if (Q.values[p] !== 0) w.line('', problem.colNames[j], problem.colNames[Q.rowIdx[p]], sign * Q.values[p] + 0);
    }
  }
}

interface RowEncoding {
  type: 'E' | 'L' | 'G';
  rhs: number;
  range?: number;
}

function rowEncoding(l: number, u: number): RowEncoding {
  if (l === u) return { type: 'E', rhs: l };
  if (l === -Infinity && u === Infinity) return { type: 'G', rhs: -Infinity };
  if (l === -Infinity) return { type: 'L', rhs: u };
  if (u === Infinity) return { type: 'G', rhs: l };
  return exactRange(l, u);
}

/** A range R with l + R = u (G row) or u − R = l (L row) exactly in floating point, when one exists nearby. */
function exactRange(l: number, u: number): RowEncoding {
  const r = u - l;
  for (const candidate of [r, r * (1 + Number.EPSILON), r * (1 - Number.EPSILON), r * (1 + 2 * Number.EPSILON), r * (1 - 2 * Number.EPSILON)]) {
    if (l + candidate === u) return { type: 'G', rhs: l, range: candidate };
    if (u - candidate === l) return { type: 'L', rhs: u, range: candidate };
  }
  return { type: 'G', rhs: l, range: r };
}

function formatNumber(v: number): string {
  if (v === Infinity) return '1e+30';
  if (v === -Infinity) return '-1e+30';
  return Object.is(v, -0) ? '0' : String(v);
}

function objectiveRowName(rowNames: string[]): string {
  const taken = new Set(rowNames);
  let name = 'obj';
  for (let k = 1; taken.has(name); k++) name = `obj${k}`;
  return name;
}

function assertUniqueNames(names: string[], kind: string): void {
  const seen = new Set<string>();
  for (const name of names) {
    if (seen.has(name)) throw new Error(`writeMps: ${kind} name '${name}' is used twice; MPS needs unique names`);
    seen.add(name);
  }
}
