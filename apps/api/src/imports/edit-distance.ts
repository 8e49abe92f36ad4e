/**
 * Levenshtein edit distance (insertions, deletions, substitutions; Levenshtein 1966; the
 * two-row dynamic programme of Wagner & Fischer 1974), case-insensitive. Stops early once every
 * entry of a row exceeds `limit`, returning limit + 1.
 */
export function editDistance(a: string, b: string, limit = Infinity): number {
  const s = a.toLowerCase();
  const t = b.toLowerCase();
  if (Math.abs(s.length - t.length) > limit) return limit + 1;
  let previous = Array.from({ length: t.length + 1 }, (_, j) => j);
  let current = new Array<number>(t.length + 1);
  for (let i = 1; i <= s.length; i += 1) {
    current[0] = i;
    let rowMin = current[0];
    for (let j = 1; j <= t.length; j += 1) {
      const cost = s[i - 1] === t[j - 1] ? 0 : 1;
      current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + cost);
      rowMin = Math.min(rowMin, current[j]);
    }
    if (rowMin > limit) return limit + 1;
    [previous, current] = [current, previous];
  }
  return previous[t.length];
}

/**
 * The known code closest to `code`, when it is close enough to be a likely typo: at most a
 * third of the code's length in edits (at least 1, at most 3). Ties go to the alphabetically first.
 */
export function closestCode(code: string, known: Iterable<string>): string | null {
  const limit = Math.min(3, Math.max(1, Math.floor(code.length / 3)));
  let best: { code: string; distance: number } | null = null;
  for (const candidate of known) {
    const d = editDistance(code, candidate, best ? Math.min(best.distance, limit) : limit);
    if (d > limit) continue;
    if (!best || d < best.distance || (d === best.distance && candidate < best.code)) best = { code: candidate, distance: d };
  }
  return best?.code ?? null;
}

/** "There is no product with the code X." plus "Did you mean Y?" when one is close. */
export function unknownCodeMessage(what: string, code: string, known: Iterable<string>): string {
  const suggestion = closestCode(code, known);
  return `There is no ${what} with the code ${code}.${suggestion ? ` Did you mean ${suggestion}?` : ''}`;
}
