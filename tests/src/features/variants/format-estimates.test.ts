import { describe, expect, it } from 'vitest';
import { formatKcatOverKmWithSe, formatKcatWithSe, formatKmWithSe, formatRatioWithSe, kmUnitFor } from '@/features/variants/format-estimates';

// Rounding rule under test: the error to two significant figures and the value to the error's last
// digit (common practice when reporting a measured value with its uncertainty). Values are invented.
describe('estimates with standard errors', () => {
  it('rounds kcat to the last digit of its two-figure error', () => {
    expect(formatKcatWithSe({ value: 0.9341839, se: 0.0071204 })).toBe('0.9342 ± 0.0071 s⁻¹');
    expect(formatKcatWithSe({ value: 3.3592974, se: 0.0412883 })).toBe('3.359 ± 0.041 s⁻¹');
    expect(formatKcatWithSe({ value: 12.5, se: null })).toBe('12.5 s⁻¹');
  });

  it('keeps trailing zeros that carry precision', () => {
    expect(formatKmWithSe({ value: 1.0045354e-3, se: 3.06788e-5 })).toBe('1.005 ± 0.031 mM');
    expect(formatKmWithSe({ value: 3.0e-3, se: 1.7e-4 })).toBe('3.00 ± 0.17 mM');
  });

  it('puts Km and its error in one unit chosen by the value', () => {
    expect(formatKmWithSe({ value: 2.5e-5, se: 1.2e-6 })).toBe('25.0 ± 1.2 µM');
    expect(formatKmWithSe({ value: 4.2e-8, se: 3e-9 })).toBe('42.0 ± 3.0 nM');
  });

  it('shares one power of ten between a small kcat and its error', () => {
    expect(formatKcatWithSe({ value: 1.32e-3, se: 4.1e-5 })).toBe('(1.320 ± 0.041) × 10⁻³ s⁻¹');
  });

  it('writes kcat/Km in scientific notation with a shared power of ten', () => {
    expect(formatKcatOverKmWithSe({ value: 1108.973, se: 32.7788 })).toBe('(1.109 ± 0.033) × 10³ M⁻¹ s⁻¹');
    expect(formatKcatOverKmWithSe({ value: 4.3666, se: 0.13115 })).toBe('(4.37 ± 0.13) × 10⁰ M⁻¹ s⁻¹');
    expect(formatKcatOverKmWithSe(null)).toBe('—');
  });

  it('formats a dimensionless ratio the same way', () => {
    expect(formatRatioWithSe({ value: 3.0130328, se: 0.1488688 })).toBe('3.01 ± 0.15');
    expect(formatRatioWithSe(null)).toBe('—');
  });

  it('writes a column of Km in the one unit that suits its median', () => {
    expect(kmUnitFor([9.63e-4, 1.005e-3, 1.107e-3, null])).toBe('mM');
    expect(kmUnitFor([2e-6, 4e-5, 9e-4])).toBe('µM');
    expect(kmUnitFor([])).toBe('mM');
    expect(formatKmWithSe({ value: 9.63e-4, se: 4.2e-5 }, 'mM')).toBe('0.963 ± 0.042 mM');
    expect(formatKmWithSe({ value: 9.63e-4, se: 4.2e-5 }, 'mM', false)).toBe('0.963 ± 0.042');
  });
});
