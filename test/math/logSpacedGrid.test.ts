import { describe, expect, it } from 'vitest';
import { logSpacedGrid } from '../../src/math/index.js';

describe('logSpacedGrid', () => {
  it('spaces points evenly in log10 between the two ends, both included (common practice: numpy.logspace(0, 2, 3) = [1, 10, 100])', () => {
    const grid = logSpacedGrid(1, 100, 3);
    expect(grid[0]).toBe(1);
    expect(grid[1]).toBeCloseTo(10, 12);
    expect(grid[2]).toBeCloseTo(100, 12);
  });

  it('has a constant ratio between neighbours, (max / min)^(1 / (points - 1))', () => {
    const grid = logSpacedGrid(1e-3, 2.3, 120);
    expect(grid.length).toBe(120);
    const ratio = (2.3 / 1e-3) ** (1 / 119);
    for (let i = 1; i < grid.length; i++) expect(grid[i] / grid[i - 1]).toBeCloseTo(ratio, 12);
    expect(grid[119]).toBeCloseTo(2.3, 12);
  });
});
