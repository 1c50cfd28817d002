import { describe, expect, it } from 'vitest';
import { groupByConditions } from '../../../shared/comparison/group-by-conditions';

// Plumbing of the grouping with invented conditions; the matching rule itself is the product's (DESIGN.md).
const celsius = (value: number) => value + 273.15;

describe('groupByConditions', () => {
  it('separates conditions that do not match and joins those that do', () => {
    const groups = groupByConditions([
      { id: 1, substrate: 'pNPA', temperatureKelvin: celsius(37), ph: 6 },
      { id: 2, substrate: 'pNPA', temperatureKelvin: celsius(25), ph: 6 },
      { id: 3, substrate: 'PNPA ', temperatureKelvin: celsius(37.2), ph: 6.05 },
      { id: 4, substrate: 'pNPB', temperatureKelvin: celsius(37), ph: 6 },
    ]);
    expect(groups.map((group) => group.map((item) => item.id))).toEqual([[2], [1, 3], [4]]);
  });

  it('keeps every pair inside a group within the tolerances (no chaining)', () => {
    // 36.8, 37.2 and 37.6 °C: neighbours are 0.4 apart, the ends 0.8.
    const groups = groupByConditions([
      { id: 1, substrate: 'S', temperatureKelvin: celsius(36.8), ph: 7 },
      { id: 2, substrate: 'S', temperatureKelvin: celsius(37.2), ph: 7 },
      { id: 3, substrate: 'S', temperatureKelvin: celsius(37.6), ph: 7 },
    ]);
    expect(groups.map((group) => group.map((item) => item.id))).toEqual([[1, 2], [3]]);
  });

  it('does not depend on the input order', () => {
    const items = [
      { id: 1, substrate: 'S', temperatureKelvin: celsius(36.8), ph: 7 },
      { id: 2, substrate: 'S', temperatureKelvin: celsius(37.2), ph: 7 },
      { id: 3, substrate: 'S', temperatureKelvin: celsius(37.6), ph: 7 },
    ];
    const ids = (list: typeof items) => groupByConditions(list).map((group) => group.map((item) => item.id));
    expect(ids([...items].reverse())).toEqual(ids(items));
  });
});
