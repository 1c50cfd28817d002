import { describe, expect, it } from 'vitest';
import { parameterCovariance } from '../../../shared/kinetics/parameter-covariance';
import { relativeError } from './test-helpers';

describe('parameterCovariance', () => {
  it('inverts a diagonal JᵀJ and scales by s²', () => {
    expect(parameterCovariance([4, 0, 0, 1], 2, 2)).toEqual([[0.5, 0], [0, 2]]);
  });

  it('inverts a correlated 2 × 2 matrix: [[2, 1], [1, 2]]⁻¹ = [[2, −1], [−1, 2]]/3 (by hand)', () => {
    const covariance = parameterCovariance([2, 1, 1, 2], 2, 1)!;
    expect(covariance[0][0]).toBeCloseTo(2 / 3, 15);
    expect(covariance[0][1]).toBeCloseTo(-1 / 3, 15);
    expect(covariance[1][0]).toBe(covariance[0][1]);
  });

  it('loses no accuracy to badly scaled parameters (diagonal 10¹⁰ beside 10⁻⁶, correlation 0.999)', () => {
    // For A = D·[[1, ρ], [ρ, 1]]·D the inverse is D⁻¹·[[1, −ρ], [−ρ, 1]]·D⁻¹/(1 − ρ²).
    const d = [1e5, 1e-3];
    const rho = 0.999;
    const covariance = parameterCovariance([d[0] * d[0], rho * d[0] * d[1], rho * d[0] * d[1], d[1] * d[1]], 2, 1)!;
    const determinant = 1 - rho * rho;
    expect(relativeError(covariance[0][0], 1 / (d[0] * d[0] * determinant))).toBeLessThan(1e-12);
    expect(relativeError(covariance[1][1], 1 / (d[1] * d[1] * determinant))).toBeLessThan(1e-12);
    expect(relativeError(covariance[0][1], -rho / (d[0] * d[1] * determinant))).toBeLessThan(1e-12);
  });

  it('inverts a 3 × 3 matrix: A·A⁻¹ = I', () => {
    const a = [4, 2, 0.6, 2, 5, 1.5, 0.6, 1.5, 3];
    const inverse = parameterCovariance(a, 3, 1)!;
    for (let i = 0; i < 3; i += 1) {
      for (let j = 0; j < 3; j += 1) {
        let sum = 0;
        for (let k = 0; k < 3; k += 1) sum += a[i * 3 + k] * inverse[k][j];
        expect(sum).toBeCloseTo(i === j ? 1 : 0, 13);
      }
    }
  });

  it('returns null for a singular matrix or a column without influence', () => {
    expect(parameterCovariance([1, 1, 1, 1], 2, 1)).toBeNull();
    expect(parameterCovariance([1, 1 - 1e-14, 1 - 1e-14, 1], 2, 1)).toBeNull();
    expect(parameterCovariance([1, 0, 0, 0], 2, 1)).toBeNull();
  });
});
