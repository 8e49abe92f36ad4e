import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { testResults } from '@/testing/plan-fixtures';
import { ResultsSummary } from './results-summary';

describe('results summary totals', () => {
  it('when whole units are on, then the margin is named the whole-units margin and the LP optimum is shown as the LP bound', () => {
    // the rounded plan's margin (990) lies below its LP relaxation's optimum (1,000), which bounds it
    // (Winston, Operations Research, ch. 9, from memory: the LP relaxation bounds an integer programme)
    render(<ResultsSummary results={testResults} wholeUnits />);
    expect(screen.getByText('Margin, whole units:').nextElementSibling).toHaveTextContent('990.00 EUR');
    expect(screen.getByText('LP bound:').nextElementSibling).toHaveTextContent('1,000.00 EUR');
  });

  it('when whole units are off, then the margin is the plan’s own and no bound is shown', () => {
    render(<ResultsSummary results={testResults} wholeUnits={false} />);
    expect(screen.getByText('Margin:').nextElementSibling).toHaveTextContent('990.00 EUR');
    expect(screen.queryByText('LP bound:')).toBeNull();
  });
});
