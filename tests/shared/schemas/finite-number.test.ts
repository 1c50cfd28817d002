import { describe, expect, it } from 'vitest';
import { finiteNumber } from '@shared/schemas/finite-number';

describe('finiteNumber', () => {
  it('takes zero and sizes from 10⁻¹⁰⁰ to 10¹⁰⁰ of either sign', () => {
    for (const value of [0, 1e-100, -1e-100, 1e100, -1e100, 6.02214076e23, 1.380649e-23]) expect(finiteNumber().safeParse(value).success).toBe(true);
  });

  it('refuses sizes whose squares or ratios would overflow a double (IEEE 754 binary64: about 1.8 × 10³⁰⁸ at most)', () => {
    for (const value of [1e101, -1e300, 1e308, 1e-101, 5e-324]) {
      const result = finiteNumber().safeParse(value);
      expect(result.success).toBe(false);
      expect(result.error?.issues[0].message).toBe('must be zero or between 10⁻¹⁰⁰ and 10¹⁰⁰ in size');
    }
    expect(finiteNumber().safeParse(Number.POSITIVE_INFINITY).success).toBe(false);
  });
});
