import { createHash } from 'node:crypto';

/** JSON with object keys sorted at every level, so equal data always gives equal text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.keys(value as Record<string, unknown>)
        .sort()
        .filter((k) => (value as Record<string, unknown>)[k] !== undefined)
        .map((k) => [k, sortKeys((value as Record<string, unknown>)[k])]),
    );
  }
  return value;
}

/** SHA-256 (hex) of a text. */
export function sha256(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/** SHA-256 (hex) of the canonical JSON of `value`: the hash kept in the audit trail. */
export function hashOf(value: unknown): string {
  return sha256(canonicalJson(value));
}
