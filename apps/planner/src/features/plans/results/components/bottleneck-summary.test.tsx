import { describe, expect, it } from 'vitest';
import type { Bottleneck } from '@millrace/contracts';
import { bottleneckSummary, weekRanges } from './bottleneck-summary';

const capacity = (item: string, itemName: string, weeks: [number, number][]): Bottleneck => ({
  kind: 'capacity',
  item,
  itemName,
  unit: 'per_hour',
  weeks: weeks.map(([week, value]) => ({ week, weekStart: '2026-12-07', value })),
  message: '',
});

describe('bottleneck summary sentence', () => {
  it('when one work center binds in consecutive weeks at one value, then the sentence names it, the weeks and the value', () => {
    const text = bottleneckSummary({ currency: 'EUR', bottlenecks: [capacity('EDGE', 'Edge bander', [[4, 38.1], [5, 38.1], [6, 38.1]])] });
    expect(text).toBe('Edge bander holds the plan back in weeks 4–6; one more hour there is worth 38.10 EUR.');
  });

  it('when several work centers bind, then the one worth most is named with its peak week and the others are counted', () => {
    const text = bottleneckSummary({
      currency: 'EUR',
      bottlenecks: [capacity('SAW', 'Saw', [[2, 5]]), capacity('SPRAY', 'Spray booth', [[1, 72.19], [2, 72.5], [3, 73.68], [8, 30.65]])],
    });
    expect(text).toBe('Spray booth holds the plan back in weeks 1–3 and 8; one more hour there is worth up to 73.68 EUR (in week 3). 1 more work center also binds.');
  });

  it('when no work center binds but a material does, then the material is named', () => {
    const text = bottleneckSummary({
      currency: 'EUR',
      bottlenecks: [capacity('SAW', 'Saw', [[2, 1e-9]]), { ...capacity('OAK', 'Oak board', [[2, 4.84]]), kind: 'material', unit: 'per_unit' }],
    });
    expect(text).toBe('No work center holds the plan back; Oak board limits it in week 2; one more unit there is worth 4.84 EUR.');
  });

  it('when nothing binds, then it says so', () => {
    expect(bottleneckSummary({ currency: 'EUR', bottlenecks: [] })).toMatch(/^Nothing holds the plan back/);
  });

  it('when weeks are listed, then runs are joined with an en dash', () => {
    expect(weekRanges([9, 4, 5, 6, 11, 12])).toBe('weeks 4–6, 9 and 11–12');
    expect(weekRanges([3])).toBe('week 3');
  });
});
