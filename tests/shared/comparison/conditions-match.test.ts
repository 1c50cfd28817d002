import { describe, expect, it } from 'vitest';
import {
  conditionsMatch,
  MATCH_PH_TOLERANCE,
  MATCH_TEMPERATURE_TOLERANCE_KELVIN,
  substrateKey,
} from '../../../shared/comparison/conditions-match';

// The tolerances are the product's comparison rule (DESIGN.md: same substrate, temperature within 0.5 °C,
// pH within 0.1); 0 °C = 273.15 K exactly (SI Brochure, 9th ed., §2.3.1).
const at37 = { substrate: 'pNP-acetate', temperatureKelvin: 37 + 273.15, ph: 6.0 };

describe('conditionsMatch', () => {
  it('uses the tolerances of the comparison rule', () => {
    expect(MATCH_TEMPERATURE_TOLERANCE_KELVIN).toBe(0.5);
    expect(MATCH_PH_TOLERANCE).toBe(0.1);
  });

  it('matches the same substrate written with other case and spaces', () => {
    expect(conditionsMatch(at37, { ...at37, substrate: '  PNP-Acetate ' })).toBe(true);
    expect(substrateKey('  4-Nitrophenyl   Acetate')).toBe('4-nitrophenyl acetate');
  });

  it('refuses another substrate', () => {
    expect(conditionsMatch(at37, { ...at37, substrate: 'pNP-butyrate' })).toBe(false);
  });

  it('matches at exactly 0.5 °C and 0.1 pH apart, entered in °C as the API takes them', () => {
    expect(conditionsMatch(at37, { ...at37, temperatureKelvin: 37.5 + 273.15 })).toBe(true);
    expect(conditionsMatch(at37, { ...at37, temperatureKelvin: 36.5 + 273.15 })).toBe(true);
    expect(conditionsMatch(at37, { ...at37, ph: 6.1 })).toBe(true);
    expect(conditionsMatch(at37, { ...at37, ph: 5.9 })).toBe(true);
  });

  it('refuses just beyond either tolerance', () => {
    expect(conditionsMatch(at37, { ...at37, temperatureKelvin: 37.51 + 273.15 })).toBe(false);
    expect(conditionsMatch(at37, { ...at37, ph: 6.11 })).toBe(false);
    expect(conditionsMatch(at37, { ...at37, temperatureKelvin: 25 + 273.15 })).toBe(false);
  });
});
