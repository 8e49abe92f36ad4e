import { render } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import type { MaterialCall } from '@millrace/contracts';
import { materialCallsColumns } from './material-calls-columns';

const call = (over: Partial<MaterialCall>): MaterialCall => ({
  material: 'BRK-CORNER',
  materialName: 'Steel table corner brackets',
  unit: 'pcs',
  week: 7,
  weekStart: '2027-01-11',
  grossRequirement: 52,
  scheduledReceipt: 0,
  projectedAvailable: 0,
  netRequirement: 24,
  plannedReceipt: 24,
  releaseWeek: 4,
  pastDue: false,
  spend: 20.4,
  ...over,
});

const cellText = (header: string, value: MaterialCall): string => {
  const column = materialCallsColumns.find((c) => c.header === header)!;
  const cell = column.cell as (ctx: { row: { original: MaterialCall }; getValue: () => unknown }) => ReactNode;
  const { container } = render(<>{cell({ row: { original: value }, getValue: () => value[(column as { accessorKey: keyof MaterialCall }).accessorKey] })}</>);
  return container.textContent ?? '';
};

describe('material calls columns', () => {
  it('when an order is released ahead of its need week, then its order week carries its start date like the need week does', () => {
    // MRP offsets the release by the lead time in whole weeks (Orlicky's MRP, textbook practice): 3 weeks before 11 Jan is 21 Dec.
    expect(cellText('Order in week', call({}))).toBe('4 (21 Dec)');
    expect(cellText('Needed in week', call({}))).toBe('7 (11 Jan)');
  });

  it('when an order should already have been placed, then it says past due with the week it was due', () => {
    expect(cellText('Order in week', call({ week: 1, weekStart: '2026-11-30', releaseWeek: 0, pastDue: true }))).toBe('⚑ past due (week of 23 Nov)');
  });

  it('when a call costs money, then the spend is written to the cent', () => {
    // Money to the cent: common practice, no source.
    expect(cellText('Spend', call({ spend: 20.4 }))).toBe('20.40');
    expect(cellText('Spend', call({ spend: 1234 }))).toBe('1,234.00');
  });
});
