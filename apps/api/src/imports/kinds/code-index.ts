import { unknownCodeMessage } from '../edit-distance';

/** Records by code, looked up without case (as the database's unique keys compare them). */
export class CodeIndex<T extends { code: string }> {
  private readonly byKey = new Map<string, T>();
  constructor(readonly what: string, items: readonly T[]) {
    for (const item of items) this.byKey.set(item.code.toLowerCase(), item);
  }
  get(code: string): T | undefined {
    return this.byKey.get(code.toLowerCase());
  }
  codes(): string[] {
    return [...this.byKey.values()].map((i) => i.code);
  }
  unknown(code: string, alsoKnown: readonly string[] = []): string {
    return unknownCodeMessage(this.what, code, [...this.codes(), ...alsoKnown]);
  }
}

/** Remembers the first row of each key: a later row with the same key is a duplicate. */
export class FirstRows {
  private readonly rows = new Map<string, number>();
  /** the row number that already had the key, or null (and the key is now taken by this row) */
  seen(key: string, rowNumber: number): number | null {
    const first = this.rows.get(key);
    if (first !== undefined) return first;
    this.rows.set(key, rowNumber);
    return null;
  }
}

/** Same quantity up to the precision of a DECIMAL column. */
export function sameQty(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}

export function unitMismatch(fileUnit: string, code: string, itemUnit: string): string | null {
  return fileUnit.trim().toLowerCase() === itemUnit.trim().toLowerCase() ? null : `The unit ${fileUnit} does not match the unit of ${code} (${itemUnit}).`;
}
