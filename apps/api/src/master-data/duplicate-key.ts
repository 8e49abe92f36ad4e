/**
 * True when MariaDB refused a write because a unique key already holds the value (two people
 * creating the same code at the same moment: the use case checked first, the key decides).
 */
export function isDuplicateKey(err: unknown): boolean {
  const e = err as { code?: string; driverError?: { code?: string } } | null;
  return e?.code === 'ER_DUP_ENTRY' || e?.driverError?.code === 'ER_DUP_ENTRY';
}
