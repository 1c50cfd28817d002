import { describe, expect, it } from 'vitest';
import { freeEnergyFromLogRatio } from '../../../shared/kinetics/free-energy-from-log-ratio';

describe('freeEnergyFromLogRatio', () => {
  it('gives −RT·L in kJ/mol and kcal/mol: RT·ln 10 at 298.15 K = 5.7080095 kJ/mol = 1.3642470 kcal/mol (issue 3)', () => {
    const result = freeEnergyFromLogRatio(-Math.LN10, 0.1, 298.15);
    expect(result.kJPerMol.value).toBeCloseTo(5.7080095, 7);
    expect(result.kcalPerMol.value).toBeCloseTo(1.364247, 6);
    expect(result.kJPerMol.se).toBeCloseTo((0.1 * 8.31446261815324 * 298.15) / 1000, 14);
  });
});
