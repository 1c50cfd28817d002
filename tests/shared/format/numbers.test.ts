import { describe, expect, it } from 'vitest';
import {
  energyIn,
  formatEnergy,
  formatEnergyFigures,
  formatFoldChange,
  formatKcat,
  formatKcatOverKm,
  formatKm,
  formatNumber,
  formatPh,
  powerOfTen,
} from '../../../shared/format/numbers';

// The minus sign is U+2212 and powers of ten use the Unicode superscript figures U+2070–U+2079 with
// U+207B SUPERSCRIPT MINUS (Unicode Standard, Superscripts and Subscripts block); the written forms
// below are worked by hand.

describe('powerOfTen', () => {
  it('writes the exponent in superscript figures with the superscript minus', () => {
    // Superscript one, two and three are U+00B9, U+00B2, U+00B3 (Latin-1 Supplement); zero and four to nine are
    // U+2070 and U+2074–U+2079, the minus U+207B (Unicode code charts, from memory).
    expect(powerOfTen(0)).toBe('10\u2070');
    expect(powerOfTen(2)).toBe('10\u00B2');
    expect(powerOfTen(-4)).toBe('10\u207B\u2074');
    expect(powerOfTen(21)).toBe('10\u00B2\u00B9');
    expect(powerOfTen(-10)).toBe('10\u207B\u00B9\u2070');
    expect(powerOfTen(3)).toBe('10\u00B3');
    expect(powerOfTen(56789)).toBe('10\u2075\u2076\u2077\u2078\u2079');
  });
});

describe('formatNumber', () => {
  it('keeps plain decimals from 0.01 up to 10,000, rounded to three significant figures', () => {
    expect(formatNumber(0.01)).toBe('0.01');
    expect(formatNumber(12.345)).toBe('12.3');
    expect(formatNumber(9990)).toBe('9990');
    expect(formatNumber(-0.5)).toBe('\u22120.5');
    expect(formatNumber(0)).toBe('0');
  });

  it('switches to a × 10ⁿ at 10,000 and below 0.01, with superscript exponents and a true minus sign', () => {
    // 10,000 = 1.00 × 10⁴; 0.00999 = 9.99 × 10⁻³; −253,000 = −2.53 × 10⁵.
    expect(formatNumber(10_000)).toBe('1.00 × 10\u2074');
    expect(formatNumber(0.00999)).toBe('9.99 × 10\u207b\u00b3');
    expect(formatNumber(-2.53e5)).toBe('\u22122.53 × 10\u2075');
    expect(formatNumber(1.2e-12)).toBe('1.20 × 10\u207b\u00b9\u00b2');
  });

  it('honours the number of significant figures asked for', () => {
    expect(formatNumber(2.63, 2)).toBe('2.6');
    expect(formatNumber(31_400, 2)).toBe('3.1 × 10⁴');
  });

  it('writes a dash for a missing or non-finite value', () => {
    expect(formatNumber(null)).toBe('—');
    expect(formatNumber(undefined)).toBe('—');
    expect(formatNumber(Number.NaN)).toBe('—');
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe('—');
  });
});

describe('rate constants with their units', () => {
  it('writes kcat in s⁻¹', () => {
    expect(formatKcat(12.34)).toBe('12.3 s⁻¹');
    expect(formatKcat(null)).toBe('—');
  });

  it('writes Km in mM, µM or nM by SI prefix (1 mM = 10⁻³ M, 1 µM = 10⁻⁶ M, 1 nM = 10⁻⁹ M; SI Brochure, 9th ed., table 7, from memory)', () => {
    expect(formatKm(1e-3)).toBe('1 mM');
    expect(formatKm(9.99e-4)).toBe('999 µM');
    expect(formatKm(2.5e-5)).toBe('25 µM');
    expect(formatKm(3e-9)).toBe('3 nM');
    expect(formatKm(Number.NaN)).toBe('—');
  });

  it('writes kcat/Km in scientific notation even inside the plain-decimal range', () => {
    expect(formatKcatOverKm(921.4)).toBe('9.21 × 10² M⁻¹ s⁻¹');
    expect(formatKcatOverKm(3e4)).toBe('3.00 × 10⁴ M⁻¹ s⁻¹');
    expect(formatKcatOverKm(-1.5e-2)).toBe('\u22121.50 × 10⁻² M⁻¹ s⁻¹');
    expect(formatKcatOverKm(undefined)).toBe('—');
  });
});

describe('energies', () => {
  it('converts kJ/mol to kcal/mol with the thermochemical calorie, 4.184 J exactly (ISO 80000-5; IUPAC Green Book §7.2)', () => {
    expect(energyIn(4.184, 'kcal/mol')).toBeCloseTo(1, 12);
    expect(energyIn(-2.53, 'kJ/mol')).toBe(-2.53);
  });

  it('writes ΔΔG‡ ± SE to two decimals, with or without the unit', () => {
    // RT·ln 10 at 298.15 K is 5.708 kJ/mol, 1.364 kcal/mol (R from CODATA 2018); 0.2 / 4.184 = 0.0478.
    expect(formatEnergy(5.708, 0.2, 'kcal/mol')).toBe('1.36 ± 0.05 kcal/mol');
    expect(formatEnergy(-2.53, 0.18, 'kJ/mol')).toBe('\u22122.53 ± 0.18 kJ/mol');
    expect(formatEnergyFigures(-2.83, 0.18, 'kJ/mol')).toBe('\u22122.83 ± 0.18');
    expect(formatEnergyFigures(5.708, 0.2, 'kcal/mol')).toBe('1.36 ± 0.05');
  });

  it('leaves the error out when it is unknown, and writes a dash for a missing energy', () => {
    expect(formatEnergy(1.5, null, 'kJ/mol')).toBe('1.50 kJ/mol');
    expect(formatEnergyFigures(1.5, Number.NaN, 'kJ/mol')).toBe('1.50');
    expect(formatEnergy(null, 0.1, 'kJ/mol')).toBe('—');
    expect(formatEnergyFigures(undefined, 0.1, 'kJ/mol')).toBe('—');
  });
});

describe('fold change and pH', () => {
  it('writes a fold change to two significant figures with the multiplication sign', () => {
    expect(formatFoldChange(2.63)).toBe('2.6×');
    expect(formatFoldChange(3)).toBe('3×');
    expect(formatFoldChange(0.5249)).toBe('0.52×');
    expect(formatFoldChange(null)).toBe('—');
  });

  it('writes a pH to two decimals', () => {
    expect(formatPh(7.5)).toBe('7.50');
    expect(formatPh(7.456)).toBe('7.46');
    expect(formatPh(Number.NaN)).toBe('—');
  });
});
