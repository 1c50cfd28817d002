import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { GAS_CONSTANT, JOULES_PER_CALORIE, convertUnit } from '../../../shared/kinetics/units';

describe('convertUnit', () => {
  it('holds the exact constants: R = 8.31446261815324 J/(mol·K) (SI 2019) and 1 cal = 4.184 J (thermochemical)', () => {
    // R = N_A·k = 6.02214076e23 × 1.380649e-23, both exact since the 2019 redefinition of the SI.
    expect(GAS_CONSTANT).toBe(8.31446261815324);
    expect(GAS_CONSTANT).toBeCloseTo(6.02214076e23 * 1.380649e-23, 12);
    expect(JOULES_PER_CALORIE).toBe(4.184);
  });

  it('converts concentrations by exact powers of ten', () => {
    expect(convertUnit(1, 'mM', 'M')).toBe(0.001);
    expect(convertUnit(250, 'µM', 'mM')).toBe(0.25);
    expect(convertUnit(1, 'µM', 'nM')).toBe(1000);
    expect(convertUnit(3, 'nM', 'M')).toBe(3e-9);
    expect(convertUnit(0.5, 'M', 'µM')).toBe(500000);
    expect(convertUnit(42, 'mM', 'mM')).toBe(42);
  });

  it('converts first-order rate constants between per minute and per second', () => {
    expect(convertUnit(120, '1/min', '1/s')).toBe(2);
    expect(convertUnit(2, '1/s', '1/min')).toBe(120);
  });

  it('converts molar energies with the thermochemical calorie', () => {
    expect(convertUnit(1, 'kcal/mol', 'kJ/mol')).toBe(4.184);
    expect(convertUnit(4.184, 'kJ/mol', 'kcal/mol')).toBe(1);
    // RT·ln 10 at 298.15 K (issue 3, check 3): 5.7080095 kJ/mol = 1.3642470 kcal/mol.
    expect(convertUnit(5.7080095, 'kJ/mol', 'kcal/mol')).toBeCloseTo(1.364247, 6);
  });

  it('throws KineticsInputError for a non-finite value or units of different kinds', () => {
    expect(() => convertUnit(Number.NaN, 'M', 'mM')).toThrow(new KineticsInputError('convertUnit requires a finite value'));
    // A caller without the types (plain JavaScript, a parsed request) can still mix kinds.
    const mixed = convertUnit as unknown as (value: number, from: string, to: string) => number;
    expect(() => mixed(1, 'M', '1/s')).toThrow(new KineticsInputError('convertUnit requires units of the same kind'));
  });
});
