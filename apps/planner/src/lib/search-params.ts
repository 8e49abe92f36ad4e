/** A copy of `prev` with `key` set to `value`, or without `key` when value is empty or null. */
export function withSearchParam(prev: URLSearchParams, key: string, value: string | null): URLSearchParams {
  const next = new URLSearchParams(prev);
  if (value) next.set(key, value);
  else next.delete(key);
  return next;
}
