import { describe, expect, it } from 'vitest';
import { energyIn, formatEnergy, formatKcatOverKm, formatKm, formatNumber } from '@/lib/format';

describe('formatNumber', () => {
  it('writes three significant figures, switching to a × 10ⁿ outside 0.01–10,000', () => {
    expect(formatNumber(12.345)).toBe('12.3');
    expect(formatNumber(0.000111)).toBe('1.11 × 10⁻⁴');
    expect(formatNumber(-2.53e5)).toBe('−2.53 × 10⁵');
    expect(formatNumber(Number.NaN)).toBe('—');
  });
});

describe('unit formatting', () => {
  it('chooses mM, µM or nM for Km', () => {
    expect(formatKm(1.01e-3)).toBe('1.01 mM');
    expect(formatKm(2.5e-5)).toBe('25 µM');
    expect(formatKm(3e-9)).toBe('3 nM');
  });

  it('writes kcat/Km in scientific notation', () => {
    expect(formatKcatOverKm(921.4)).toBe('9.21 × 10² M⁻¹ s⁻¹');
  });

  it('converts kJ to kcal with the thermochemical calorie, 4.184 J exactly (ISO 80000-5)', () => {
    expect(energyIn(4.184, 'kcal/mol')).toBeCloseTo(1, 12);
    expect(formatEnergy(-2.53, 0.18, 'kJ/mol')).toBe('−2.53 ± 0.18 kJ/mol');
    expect(formatEnergy(5.708, 0.2, 'kcal/mol')).toBe('1.36 ± 0.05 kcal/mol');
  });
});
