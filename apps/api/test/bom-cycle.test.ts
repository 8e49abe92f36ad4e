import { describe, expect, it } from 'vitest';
import { findBomCycle } from '../src/products/bom-cycle';

describe('BOM cycle check', () => {
  const edges = [
    { parent: 'A', child: 'B' },
    { parent: 'B', child: 'C' },
    { parent: 'B', child: 'D' },
  ];

  it('when the new components close a loop through stored edges, then the path runs from the parent back to it', () => {
    expect(findBomCycle(edges, 'C', ['A'])).toEqual(['C', 'A', 'B', 'C']);
    expect(findBomCycle(edges, 'D', ['X', 'A'])).toEqual(['D', 'A', 'B', 'D']);
  });

  it('when a product lists itself, then the cycle is the product alone', () => {
    expect(findBomCycle(edges, 'A', ['A'])).toEqual(['A', 'A']);
  });

  it('when the old lines of the parent made the loop but the new ones do not, then there is no cycle', () => {
    // C → A stored, but C's BOM is being replaced by C → D.
    expect(findBomCycle([...edges, { parent: 'C', child: 'A' }], 'C', ['D'])).toBeNull();
  });

  it('when components are shared (a diamond), then it is not a cycle', () => {
    expect(findBomCycle([...edges, { parent: 'C', child: 'D' }], 'A', ['B', 'C'])).toBeNull();
  });
});
