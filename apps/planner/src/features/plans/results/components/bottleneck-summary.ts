import type { Bottleneck, PlanResults } from '@millrace/contracts';

/** Dual values smaller than this are solver noise, not a binding limit (common practice, no source). */
export const bindingEpsilon = 1e-6;

/** [4,5,6,9] → 'weeks 4–6 and 9'; [3] → 'week 3'. */
export function weekRanges(weeks: number[]): string {
  const sorted = [...new Set(weeks)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    parts.push(i === j ? `${sorted[i]}` : `${sorted[i]}–${sorted[j]}`);
    i = j + 1;
  }
  const text = parts.length <= 1 ? parts.join('') : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
  return `${sorted.length === 1 ? 'week' : 'weeks'} ${text}`;
}

const money = (v: number) => new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(v);

/** Weeks where a limit binds (its value is above noise). */
export function bindingWeeks(b: Bottleneck) {
  return b.weeks.filter((w) => w.value > bindingEpsilon);
}

/** The strongest limit of a kind: the one whose best week is worth the most. */
function strongest(bottlenecks: Bottleneck[]): { b: Bottleneck; peak: number } | null {
  let best: { b: Bottleneck; peak: number } | null = null;
  for (const b of bottlenecks) {
    const weeks = bindingWeeks(b);
    if (weeks.length === 0) continue;
    const peak = Math.max(...weeks.map((w) => w.value));
    if (!best || peak > best.peak) best = { b, peak };
  }
  return best;
}

function worth(b: Bottleneck, peak: number, currency: string, unitWord: string): string {
  const weeks = bindingWeeks(b);
  const low = Math.min(...weeks.map((w) => w.value));
  if (Math.abs(peak - low) < 0.005) return `one more ${unitWord} there is worth ${money(peak)} ${currency}`;
  const peakWeek = weeks.find((w) => w.value === peak)!.week;
  return `one more ${unitWord} there is worth up to ${money(peak)} ${currency} (in week ${peakWeek})`;
}

/**
 * One sentence that says which work center holds the plan back and what an extra hour there is
 * worth, e.g. "Edge bander holds the plan back in weeks 4–6; one more hour there is worth 38.10 EUR."
 * Falls back to a material or supply limit, or says that nothing binds.
 */
export function bottleneckSummary(results: Pick<PlanResults, 'bottlenecks' | 'currency'>): string {
  const capacity = strongest(results.bottlenecks.filter((b) => b.kind === 'capacity'));
  if (capacity) {
    const { b, peak } = capacity;
    const others = results.bottlenecks.filter((o) => o.kind === 'capacity' && o !== b && bindingWeeks(o).length > 0);
    const also = others.length > 0 ? ` ${others.length} more work center${others.length === 1 ? '' : 's'} also bind${others.length === 1 ? 's' : ''}.` : '';
    return `${b.itemName} holds the plan back in ${weekRanges(bindingWeeks(b).map((w) => w.week))}; ${worth(b, peak, results.currency, 'hour')}.${also}`;
  }
  const material = strongest(results.bottlenecks.filter((b) => b.kind !== 'capacity'));
  if (material) {
    const { b, peak } = material;
    const what = b.kind === 'supply_cap' ? `The supply cap on ${b.itemName}` : b.itemName;
    return `No work center holds the plan back; ${what} limits it in ${weekRanges(bindingWeeks(b).map((w) => w.week))}; ${worth(b, peak, results.currency, 'unit')}.`;
  }
  return 'Nothing holds the plan back: no work center, material or supply cap is fully used in any week of the horizon.';
}
