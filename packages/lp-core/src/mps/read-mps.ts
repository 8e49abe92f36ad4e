/**
 * MPS reader, fixed and free format.
 *
 * Sections: NAME, OBJSENSE (section form `OBJSENSE` + data line, or same-line `OBJSENSE MAX`),
 * OBJNAME, ROWS, COLUMNS (with 'MARKER' 'INTORG'/'INTEND' integer markers), RHS, RANGES, BOUNDS,
 * QUADOBJ / QMATRIX, ENDATA. Conventions (all common practice, no source unless named):
 *
 *  - The first N row is the objective; further N rows are dropped with their entries.
 *  - An RHS on the objective row gives the constant c₀ = −rhs.
 *  - RANGES R on a row with right-hand side b: L → [b−|R|, b]; G → [b, b+|R|];
 *    E → [b, b+R] for R > 0 and [b+R, b] for R < 0.
 *  - Columns default to 0 ≤ x < ∞, integer columns too (not to a binary range).
 *  - UP (and UI) with a negative value on a column whose lower bound is 0 at that point sets the
 *    lower bound to −∞ (the rule of CPLEX's and COIN-OR CoinUtils' MPS readers, with a warning, from
 *    memory). HiGHS 1.15 (npm `highs`) instead keeps the lower bound 0, leaving an empty range;
 *    the test of this reader shows the difference.
 *  - |value| ≥ 1e30 means infinite.
 *  - QUADOBJ lists one triangle of Q (Q_ij = Q_ji = v); a repeat of the same pair with the same value
 *    is read as its mirror entry (some files list both triangles). QMATRIX lists the full matrix and
 *    its symmetric part is used.
 *  - Only one RHS, RANGES and BOUNDS vector per file; a second set name is an error.
 *
 * Format 'auto' (default) reads free format and falls back to fixed format (names with blanks) when
 * free format fails; if both fail, the error of the attempt that got further is reported.
 */
import type { CscMatrix, Problem } from '../problem/problem';
import { MpsParseError } from './mps-error';
import {
  type MpsFormat,
  fixedFields,
  freeTokens,
  isHeaderLine,
  isSkippedLine,
  parseMpsNumber,
} from './mps-line';

export interface ReadMpsOptions {
  format?: MpsFormat | 'auto';
}

export function readMps(text: string, options: ReadMpsOptions = {}): Problem {
  const format = options.format ?? 'auto';
  if (format !== 'auto') return new MpsReader(text, format).read();
  try {
    return new MpsReader(text, 'free').read();
  } catch (freeError) {
    if (!(freeError instanceof MpsParseError)) throw freeError;
    try {
      return new MpsReader(text, 'fixed').read();
    } catch (fixedError) {
      if (!(fixedError instanceof MpsParseError)) throw fixedError;
      throw fixedError.line > freeError.line ? fixedError : freeError;
    }
  }
}

type Section =
  | 'NONE' | 'NAME' | 'OBJSENSE' | 'OBJNAME' | 'ROWS' | 'COLUMNS' | 'RHS' | 'RANGES' | 'BOUNDS'
  | 'QUADOBJ' | 'QMATRIX' | 'ENDATA';

const SECTIONS: Section[] = [
  'NAME', 'OBJSENSE', 'OBJNAME', 'ROWS', 'COLUMNS', 'RHS', 'RANGES', 'BOUNDS', 'QUADOBJ', 'QMATRIX', 'ENDATA',
];
type RowType = 'N' | 'E' | 'L' | 'G';
const BOUND_TYPES = ['UP', 'LO', 'FX', 'FR', 'MI', 'PL', 'BV', 'LI', 'UI'] as const;
type BoundType = (typeof BOUND_TYPES)[number];
const BOUND_WITHOUT_VALUE: ReadonlySet<BoundType> = new Set(['FR', 'MI', 'PL']);

class MpsReader {
  private lineNo = 0;
  private section: Section = 'NONE';
  private name = '';
  private maximise = false;
  private objectiveName: string | undefined;
  private objectiveRow = -1; // index among all ROWS entries, -1 = none yet
  private rowTypes: RowType[] = [];
  private rowNames: string[] = [];
  private rowIndex = new Map<string, number>();
  private colNames: string[] = [];
  private colIndex = new Map<string, number>();
  private colRows: number[][] = [];
  private colVals: number[][] = [];
  private colCost: number[] = [];
  private integer: boolean[] = [];
  private inIntegerBlock = false;
  private rhs: number[] = [];
  private range: (number | undefined)[] = [];
  private objectiveRhs = 0;
  private colLower: number[] = [];
  private colUpper: number[] = [];
  private vectorName: Partial<Record<'RHS' | 'RANGES' | 'BOUNDS', string>> = {};
  private qEntries = new Map<number, number>();
  private qOrdered = new Set<number>();

  constructor(
    private readonly text: string,
    private readonly format: MpsFormat,
  ) {}

  read(): Problem {
    const lines = this.text.split(/\r?\n/);
    for (const line of lines) {
      this.lineNo++;
      if (isSkippedLine(line)) continue;
      if (isHeaderLine(line)) this.header(line);
      else this.data(line);
      if (this.section === 'ENDATA') return this.build();
    }
    this.fail('expected ENDATA before the end of the file', lines.length);
  }

  private fail(detail: string, line = this.lineNo): never {
    throw new MpsParseError(line, detail);
  }

  private header(line: string): void {
    const tokens = freeTokens(line);
    const word = tokens[0].toUpperCase() as Section;
    if (!SECTIONS.includes(word)) {
      this.fail(`expected a section name (${SECTIONS.join(', ')}), found '${tokens[0]}'`);
    }
    this.assertOrder(word);
    this.section = word;
    if (word === 'NAME') this.name = line.slice(4).trim();
    else if ((word === 'OBJSENSE' || word === 'OBJNAME') && tokens.length > 1) this.objectiveLine(tokens.slice(1));
    else if (tokens.length > 1) {
      this.fail(`expected nothing after the section name ${word}, found '${tokens.slice(1).join(' ')}'`);
    }
  }

  private assertOrder(word: Section): void {
    const needsRows: Section[] = ['COLUMNS'];
    const needsColumns: Section[] = ['RHS', 'RANGES', 'BOUNDS', 'QUADOBJ', 'QMATRIX'];
    if (needsRows.includes(word) && this.rowTypes.length === 0 && this.section !== 'ROWS') {
      this.fail(`expected a ROWS section before ${word}`);
    }
    if (needsColumns.includes(word) && this.section !== 'COLUMNS' && !needsColumns.includes(this.section)) {
      this.fail(`expected a COLUMNS section before ${word}`);
    }
    if (word === 'ENDATA' && this.section === 'NONE') this.fail('expected sections before ENDATA');
  }

  private data(line: string): void {
    switch (this.section) {
      case 'OBJSENSE':
      case 'OBJNAME':
        return this.objectiveLine(freeTokens(line));
      case 'ROWS':
        return this.rowLine(this.tokens(line, [0, 1]));
      case 'COLUMNS':
        return this.columnLine(line);
      case 'RHS':
      case 'RANGES':
        return this.rhsOrRangeLine(this.vectorTokens(line));
      case 'BOUNDS':
        return this.boundLine(this.boundTokens(line));
      case 'QUADOBJ':
      case 'QMATRIX':
        return this.quadraticLine(this.tokens(line, [1, 2, 3]));
      default:
        this.fail(`expected a section name, found the data line '${line.trim()}'`);
    }
  }

  /** Fields of a data line as tokens: free format splits on blanks, fixed format takes the given fields. */
  private tokens(line: string, fields: number[]): string[] {
    if (this.format === 'free') return freeTokens(line);
    const all = fixedFields(line);
    const picked = fields.map((f) => all[f]);
    while (picked.length > 0 && picked[picked.length - 1] === '') picked.pop();
    return picked;
  }

  /** RHS/RANGES: [set?] row value [row value]; fixed format drops a blank set name. */
  private vectorTokens(line: string): string[] {
    if (this.format === 'free') return freeTokens(line);
    const f = fixedFields(line);
    const tokens = f[1] === '' ? [f[2], f[3], f[4], f[5]] : [f[1], f[2], f[3], f[4], f[5]];
    while (tokens.length > 0 && tokens[tokens.length - 1] === '') tokens.pop();
    return tokens;
  }

  private boundTokens(line: string): string[] {
    if (this.format === 'free') return freeTokens(line);
    const f = fixedFields(line);
    const tokens = f[1] === '' ? [f[0], f[2], f[3]] : [f[0], f[1], f[2], f[3]];
    while (tokens.length > 0 && tokens[tokens.length - 1] === '') tokens.pop();
    return tokens;
  }

  private number(token: string | undefined, what: string): number {
    if (token === undefined) this.fail(`expected ${what}, found nothing`);
    const value = parseMpsNumber(token);
    if (Number.isNaN(value)) this.fail(`expected ${what} as a number, found '${token}'`);
    return value;
  }

  private objectiveLine(tokens: string[]): void {
    if (tokens.length !== 1) this.fail(`expected one word in ${this.section}, found '${tokens.join(' ')}'`);
    if (this.section === 'OBJNAME') {
      this.objectiveName = tokens[0];
      return;
    }
    const sense = tokens[0].toUpperCase();
    if (['MAX', 'MAXIMIZE', 'MAXIMISE'].includes(sense)) this.maximise = true;
    else if (['MIN', 'MINIMIZE', 'MINIMISE'].includes(sense)) this.maximise = false;
    else this.fail(`expected MAX or MIN in OBJSENSE, found '${tokens[0]}'`);
  }

  private rowLine(tokens: string[]): void {
    if (tokens.length !== 2) this.fail(`expected a row type and a row name, found '${tokens.join(' ')}'`);
    const type = tokens[0].toUpperCase();
    if (type !== 'N' && type !== 'E' && type !== 'L' && type !== 'G') {
      this.fail(`expected a row type N, E, L or G, found '${tokens[0]}'`);
    }
    const name = tokens[1];
    if (this.rowIndex.has(name)) this.fail(`row '${name}' is defined twice`);
    const index = this.rowTypes.length;
    this.rowIndex.set(name, index);
    this.rowNames.push(name);
    this.rowTypes.push(type);
    this.rhs.push(0);
    this.range.push(undefined);
    const isObjective = this.objectiveName === undefined ? this.objectiveRow < 0 : name === this.objectiveName;
    if (type === 'N' && isObjective) this.objectiveRow = index;
  }

  private columnLine(line: string): void {
    const free = freeTokens(line);
    const isMarker = this.format === 'free' ? free[1] === "'MARKER'" : fixedFields(line)[2] === "'MARKER'";
    if (isMarker) return this.markerLine(this.format === 'free' ? free : this.tokens(line, [1, 2, 4]));
    const tokens = this.tokens(line, [1, 2, 3, 4, 5]);
    if (tokens.length !== 3 && tokens.length !== 5) {
      this.fail(`expected a column name and one or two (row, value) pairs, found '${tokens.join(' ')}'`);
    }
    const col = this.column(tokens[0]);
    for (let k = 1; k < tokens.length; k += 2) {
      const row = this.row(tokens[k]);
      const value = this.number(tokens[k + 1], `the coefficient of column '${tokens[0]}' in row '${tokens[k]}'`);
      if (!Number.isFinite(value)) this.fail(`expected a finite coefficient, found '${tokens[k + 1]}'`);
      if (row === this.objectiveRow) this.colCost[col] += value;
      else if (this.rowTypes[row] !== 'N') {
        this.colRows[col].push(row);
        this.colVals[col].push(value);
      }
    }
  }

  private markerLine(tokens: string[]): void {
    const kind = (tokens[2] ?? '').replace(/'/g, '').toUpperCase();
    if (kind === 'INTORG') this.inIntegerBlock = true;
    else if (kind === 'INTEND') this.inIntegerBlock = false;
    else this.fail(`expected 'INTORG' or 'INTEND' after 'MARKER', found '${tokens[2] ?? ''}'`);
  }

  private column(name: string): number {
    const known = this.colIndex.get(name);
    if (known !== undefined) return known;
    const index = this.colNames.length;
    this.colIndex.set(name, index);
    this.colNames.push(name);
    this.colRows.push([]);
    this.colVals.push([]);
    this.colCost.push(0);
    this.integer.push(this.inIntegerBlock);
    this.colLower.push(0);
    this.colUpper.push(Infinity);
    return index;
  }

  private row(name: string): number {
    const index = this.rowIndex.get(name);
    if (index === undefined) this.fail(`expected a row named in ROWS, found '${name}'`);
    return index;
  }

  private knownColumn(name: string): number {
    const index = this.colIndex.get(name);
    if (index === undefined) this.fail(`expected a column named in COLUMNS, found '${name}'`);
    return index;
  }

  private useVector(kind: 'RHS' | 'RANGES' | 'BOUNDS', setName: string): void {
    const current = this.vectorName[kind];
    if (current === undefined) this.vectorName[kind] = setName;
    else if (current !== setName) {
      this.fail(`expected the single ${kind} vector '${current}', found a second one '${setName}'`);
    }
  }

  private rhsOrRangeLine(tokens: string[]): void {
    const kind = this.section as 'RHS' | 'RANGES';
    if (tokens.length < 2 || tokens.length > 5) {
      this.fail(`expected [set name] row value [row value] in ${kind}, found '${tokens.join(' ')}'`);
    }
    const hasSet = tokens.length % 2 === 1;
    this.useVector(kind, hasSet ? tokens[0] : '');
    for (let k = hasSet ? 1 : 0; k < tokens.length; k += 2) {
      const row = this.row(tokens[k]);
      const value = this.number(tokens[k + 1], `the ${kind} value of row '${tokens[k]}'`);
      if (kind === 'RHS') {
        if (row === this.objectiveRow) this.objectiveRhs = value;
        else this.rhs[row] = value;
      } else if (this.rowTypes[row] !== 'N') {
        if (!Number.isFinite(value)) this.fail(`expected a finite range for row '${tokens[k]}'`);
        this.range[row] = value;
      }
    }
  }

  private boundLine(tokens: string[]): void {
    const type = (tokens[0] ?? '').toUpperCase() as BoundType;
    if (!BOUND_TYPES.includes(type)) {
      this.fail(`expected a bound type (${BOUND_TYPES.join(', ')}), found '${tokens[0]}'`);
    }
    const { set, colName, valueToken } = this.splitBound(type, tokens);
    this.useVector('BOUNDS', set);
    const col = this.knownColumn(colName);
    const needsValue = !BOUND_WITHOUT_VALUE.has(type) && type !== 'BV';
    const value = needsValue ? this.number(valueToken, `the ${type} bound of column '${colName}'`) : NaN;
    this.applyBound(type, col, value);
  }

  private splitBound(type: BoundType, tokens: string[]): { set: string; colName: string; valueToken?: string } {
    const n = tokens.length;
    if (BOUND_WITHOUT_VALUE.has(type)) {
      if (n === 2) return { set: '', colName: tokens[1] };
      if (n === 3 || n === 4) return { set: tokens[1], colName: tokens[2] };
    } else if (type === 'BV') {
      if (n === 2) return { set: '', colName: tokens[1] };
      if (n === 4) return { set: tokens[1], colName: tokens[2], valueToken: tokens[3] };
      if (n === 3) {
        return this.colIndex.has(tokens[2])
          ? { set: tokens[1], colName: tokens[2] }
          : { set: '', colName: tokens[1], valueToken: tokens[2] };
      }
    } else {
      if (n === 3) return { set: '', colName: tokens[1], valueToken: tokens[2] };
      if (n === 4) return { set: tokens[1], colName: tokens[2], valueToken: tokens[3] };
    }
    this.fail(`expected ${type} [set name] column${BOUND_WITHOUT_VALUE.has(type) ? '' : ' value'}, found '${tokens.join(' ')}'`);
  }

  private applyBound(type: BoundType, col: number, value: number): void {
    switch (type) {
      case 'UP':
      case 'UI':
        if (value < 0 && this.colLower[col] === 0) this.colLower[col] = -Infinity;
        this.colUpper[col] = value;
        break;
      case 'LO':
      case 'LI':
        this.colLower[col] = value;
        break;
      case 'FX':
        if (!Number.isFinite(value)) this.fail(`expected a finite FX value for column '${this.colNames[col]}'`);
        this.colLower[col] = value;
        this.colUpper[col] = value;
        break;
      case 'FR':
        this.colLower[col] = -Infinity;
        this.colUpper[col] = Infinity;
        break;
      case 'MI':
        this.colLower[col] = -Infinity;
        break;
      case 'PL':
        this.colUpper[col] = Infinity;
        break;
      case 'BV':
        this.colLower[col] = 0;
        this.colUpper[col] = 1;
        break;
    }
    if (type === 'BV' || type === 'LI' || type === 'UI') this.integer[col] = true;
  }

  private quadraticLine(tokens: string[]): void {
    if (tokens.length !== 3) this.fail(`expected column column value in ${this.section}, found '${tokens.join(' ')}'`);
    const i = this.knownColumn(tokens[0]);
    const j = this.knownColumn(tokens[1]);
    const value = this.number(tokens[2], `the ${this.section} value`);
    if (!Number.isFinite(value)) this.fail(`expected a finite ${this.section} value, found '${tokens[2]}'`);
    const n = this.colNames.length;
    const ordered = i * n + j;
    if (this.qOrdered.has(ordered)) this.fail(`entry (${tokens[0]}, ${tokens[1]}) is given twice in ${this.section}`);
    this.qOrdered.add(ordered);
    const key = Math.max(i, j) * n + Math.min(i, j);
    const previous = this.qEntries.get(key);
    if (this.section === 'QMATRIX') {
      this.qEntries.set(key, (previous ?? 0) + (i === j ? value : value / 2));
    } else if (previous === undefined) {
      this.qEntries.set(key, value);
    } else if (Math.abs(previous - value) > 1e-12 * Math.max(1, Math.abs(value))) {
      this.fail(`QUADOBJ gives (${tokens[0]}, ${tokens[1]}) = ${value} but its mirror entry = ${previous}`);
    }
  }

  private build(): Problem {
    const keptRows: number[] = [];
    const newIndex = new Int32Array(this.rowTypes.length).fill(-1);
    this.rowTypes.forEach((type, r) => {
      if (type !== 'N') {
        newIndex[r] = keptRows.length;
        keptRows.push(r);
      }
    });
    const m = keptRows.length;
    const rowLower = new Float64Array(m);
    const rowUpper = new Float64Array(m);
    keptRows.forEach((r, i) => {
      [rowLower[i], rowUpper[i]] = rowBounds(this.rowTypes[r], this.rhs[r], this.range[r]);
    });
    const sign = this.maximise ? -1 : 1;
    const problem: Problem = {
      name: this.name,
      colNames: this.colNames,
      rowNames: keptRows.map((r) => this.rowNames[r]),
      c: Float64Array.from(this.colCost, (v) => sign * v + 0),
      c0: sign * -this.objectiveRhs + 0,
      A: this.buildA(newIndex, m),
      rowLower,
      rowUpper,
      colLower: Float64Array.from(this.colLower),
      colUpper: Float64Array.from(this.colUpper),
    };
    if (this.maximise) problem.maximise = true;
    if (this.qEntries.size > 0) problem.Q = this.buildQ(sign);
    const integerCols = this.integer.flatMap((isInt, j) => (isInt ? [j] : []));
    if (integerCols.length > 0) problem.integerCols = integerCols;
    return problem;
  }

  private buildA(newIndex: Int32Array, m: number): CscMatrix {
    const n = this.colNames.length;
    const colPtr = new Int32Array(n + 1);
    for (let j = 0; j < n; j++) colPtr[j + 1] = colPtr[j] + this.colRows[j].length;
    const rowIdx = new Int32Array(colPtr[n]);
    const values = new Float64Array(colPtr[n]);
    for (let j = 0; j < n; j++) {
      const order = this.colRows[j].map((_, k) => k).sort((a, b) => this.colRows[j][a] - this.colRows[j][b]);
      let p = colPtr[j];
      for (let k = 0; k < order.length; k++) {
        const r = this.colRows[j][order[k]];
        if (k > 0 && r === this.colRows[j][order[k - 1]]) {
          this.fail(`column '${this.colNames[j]}' has two entries in row '${this.rowNames[r]}'`, this.lineNo);
        }
        rowIdx[p] = newIndex[r];
        values[p++] = this.colVals[j][order[k]];
      }
    }
    return { m, n, colPtr, rowIdx, values };
  }

  /** Lower triangle of Q in CSC form, rows sorted within each column. */
  private buildQ(sign: number): CscMatrix {
    const n = this.colNames.length;
    const entries = [...this.qEntries.entries()]
      .map(([key, v]) => ({ row: Math.floor(key / n), col: key % n, v }))
      .sort((a, b) => a.col - b.col || a.row - b.row);
    const colPtr = new Int32Array(n + 1);
    for (const e of entries) colPtr[e.col + 1]++;
    for (let j = 0; j < n; j++) colPtr[j + 1] += colPtr[j];
    return {
      m: n,
      n,
      colPtr,
      rowIdx: Int32Array.from(entries, (e) => e.row),
      values: Float64Array.from(entries, (e) => sign * e.v + 0),
    };
  }
}

function rowBounds(type: RowType, b: number, range: number | undefined): [number, number] {
  const r = range ?? NaN;
  switch (type) {
    case 'E':
      if (range === undefined || r === 0) return [b, b];
      return r > 0 ? [b, b + r] : [b + r, b];
    case 'L':
      return [range === undefined ? -Infinity : b - Math.abs(r), b];
    case 'G':
      return [b, range === undefined ? Infinity : b + Math.abs(r)];
    default:
      return [-Infinity, Infinity];
  }
}
