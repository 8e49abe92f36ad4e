import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Caution } from '@millrace/contracts';
import { testBottlenecks, testLoad } from '@/testing/plan-fixtures';
import { LoadBoard } from './load-board';

const overLimit: Caution = {
  kind: 'working_time',
  item: 'EDGE',
  week: 2,
  message: 'Edge bander, week of 2026-12-14: 6 h overtime puts each crew at about 46 h that week, above the plant’s limit of 45 h.',
};

describe('load board', () => {
  it('when a capacity row has a bottleneck value, then its cell is marked binding with a symbol and in words', () => {
    render(<LoadBoard load={testLoad} bottlenecks={testBottlenecks} cautions={[]} />);
    const binding = screen.getByRole('cell', { name: /^Edge bander, week of 14 Dec 2026: 115 % of available/ });
    expect(binding).toHaveAccessibleName(expect.stringContaining('binding, one more hour is worth 38.1'));
    expect(within(binding).getByText('◆')).toBeInTheDocument();
    // The key to the symbols describes the board.
    expect(screen.getByRole('table', { name: 'Load per work center and week' })).toHaveAccessibleDescription(/binding \(every hour used/);
    // A dual of 1e-9 is solver noise, not a binding week; a cell without a value is never binding.
    const saw = screen.getByRole('cell', { name: /^Saw, week of 14 Dec 2026/ });
    expect(saw).not.toHaveAccessibleName(expect.stringContaining('binding'));
    expect(within(saw).queryByText('◆')).toBeNull();
    expect(screen.getByRole('cell', { name: /^Edge bander, week of 7 Dec 2026/ })).not.toHaveAccessibleName(expect.stringContaining('binding'));
  });

  it('when a week has overtime, then the hours are written next to the number and a caution defers to labour law', () => {
    render(<LoadBoard load={testLoad} bottlenecks={testBottlenecks} cautions={[]} />);
    const cell = screen.getByRole('cell', { name: /^Edge bander, week of 14 Dec 2026/ });
    expect(cell).toHaveTextContent('+6 h OT');
    expect(cell).toHaveAccessibleName(expect.stringContaining('6 h overtime'));
    expect(cell).not.toHaveTextContent('over limit');
    const note = screen.getByRole('note', { name: 'Caution: Overtime in this plan' });
    expect(note).toHaveTextContent('within the plant’s working-time limit');
    expect(note).toHaveTextContent('local labour law');
  });

  it('when overtime takes a crew past the working-time limit, then the cell is flagged next to its number', () => {
    render(<LoadBoard load={testLoad} bottlenecks={testBottlenecks} cautions={[overLimit]} />);
    const cell = screen.getByRole('cell', { name: /^Edge bander, week of 14 Dec 2026/ });
    expect(cell).toHaveTextContent('+6 h OT ⚠ over limit');
    expect(cell).toHaveAccessibleName(expect.stringContaining('overtime above the plant working-time limit'));
    expect(screen.getByRole('note', { name: 'Caution: Overtime in this plan' })).toHaveTextContent('1 work-center week would take a crew past');
  });

  it('when a week has a fraction of an hour of overtime, then it is written to one decimal like every other hour figure', () => {
    // Hours to one decimal on the shop floor: common practice, no source.
    const load = testLoad.map((r) => (r.workCenter === 'EDGE' && r.overtimeHours > 0 ? { ...r, overtimeHours: 0.96 } : r));
    render(<LoadBoard load={load} bottlenecks={testBottlenecks} cautions={[]} />);
    const cell = screen.getByRole('cell', { name: /^Edge bander, week of 14 Dec 2026/ });
    expect(cell).toHaveTextContent('+1 h OT');
    expect(cell).not.toHaveTextContent('0.96');
  });
});
