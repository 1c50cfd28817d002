import { describe, expect, it } from 'vitest';
import { canonicalUnit, compactUnit, phRateKindOfUnit, unitsOfKind } from '../../../shared/imports/unit-spelling';
import { concentrationUnits, rateUnits, specificityUnits, turnoverUnits } from '../../../shared/schemas/assay';

// Unit symbols and prefixes from the SI Brochure (BIPM, 9th ed., 2019, §5.2 and Table 7); negative exponents
// for reciprocal units (M⁻¹ s⁻¹) as in the IUPAC Green Book (3rd ed., 2007, §1.3). The ASCII spellings (uM, s-1,
// 1/(M*s), umol/L/min) are common practice in laboratory spreadsheets.
describe('canonicalUnit', () => {
  it.each([
    ['mM', 'mM'],
    ['uM', 'µM'],
    ['μM', 'µM'],
    ['µM', 'µM'],
    ['mmol/L', 'mM'],
    ['umol/l', 'µM'],
    ['nM', 'nM'],
    ['M', 'M'],
    ['mol dm-3', 'M'],
  ])('reads the concentration %s as %s', (text, unit) => {
    expect(canonicalUnit(text, 'concentration')).toBe(unit);
  });

  it.each([
    ['1/s', '1/s'],
    ['s-1', '1/s'],
    ['s^-1', '1/s'],
    ['s⁻¹', '1/s'],
    ['/s', '1/s'],
    ['per s', '1/s'],
    ['sec-1', '1/s'],
    ['1/min', '1/min'],
    ['min⁻¹', '1/min'],
  ])('reads the turnover unit %s as %s', (text, unit) => {
    expect(canonicalUnit(text, 'turnover')).toBe(unit);
  });

  it.each([
    ['M-1 s-1', 'M⁻¹ s⁻¹'],
    ['M^-1 s^-1', 'M⁻¹ s⁻¹'],
    ['M⁻¹·s⁻¹', 'M⁻¹ s⁻¹'],
    ['M⁻¹ s⁻¹', 'M⁻¹ s⁻¹'],
    ['1/(M*s)', 'M⁻¹ s⁻¹'],
    ['1/(M s)', 'M⁻¹ s⁻¹'],
    ['mM-1 s-1', 'mM⁻¹ s⁻¹'],
    ['uM-1 min-1', 'µM⁻¹ min⁻¹'],
  ])('reads the second-order unit %s as %s', (text, unit) => {
    expect(canonicalUnit(text, 'specificity')).toBe(unit);
  });

  it.each([
    ['µM/min', 'µM/min'],
    ['uM min-1', 'µM/min'],
    ['umol/L/min', 'µM/min'],
    ['mM/s', 'mM/s'],
    ['M s-1', 'M/s'],
  ])('reads the rate unit %s as %s', (text, unit) => {
    expect(canonicalUnit(text, 'rate')).toBe(unit);
  });

  it.each([
    ['°C', '°C'],
    ['℃', '°C'],
    ['degC', '°C'],
    ['C', '°C'],
    ['K', 'K'],
  ])('reads the temperature unit %s as %s', (text, unit) => {
    expect(canonicalUnit(text, 'temperature')).toBe(unit);
  });

  it('refuses units it does not convert, and units of another kind', () => {
    expect(canonicalUnit('mg/mL', 'concentration')).toBeUndefined();
    expect(canonicalUnit('mM', 'turnover')).toBeUndefined();
    expect(canonicalUnit('1/s', 'specificity')).toBeUndefined();
    expect(canonicalUnit('', 'concentration')).toBeUndefined();
    expect(canonicalUnit('°F', 'temperature')).toBeUndefined();
  });

  it('reads a pH series rate in any of the three kinds and says which it is', () => {
    expect(canonicalUnit('1/s', 'phRate')).toBe('1/s');
    expect(canonicalUnit('M-1 s-1', 'phRate')).toBe('M⁻¹ s⁻¹');
    expect(canonicalUnit('uM/min', 'phRate')).toBe('µM/min');
    expect(phRateKindOfUnit('1/min')).toBe('kcat');
    expect(phRateKindOfUnit('mM⁻¹ s⁻¹')).toBe('kcatOverKm');
    expect(phRateKindOfUnit('µM/min')).toBe('v0');
  });

  it('only ever gives spellings the API schemas accept', () => {
    const accepted = new Set<string>([...concentrationUnits, ...turnoverUnits, ...rateUnits, ...specificityUnits, '°C', 'K']);
    for (const units of Object.values(unitsOfKind)) for (const unit of units) expect(accepted.has(unit), unit).toBe(true);
  });
});

describe('compactUnit', () => {
  it('folds superscripts, carets, multiplication signs and spaces', () => {
    expect(compactUnit('M⁻¹ s⁻¹')).toBe('M-1s-1');
    expect(compactUnit('M^-1·s^(-1)')).toBe('M-1s-1');
    expect(compactUnit('1/(mM * min)')).toBe('1/(mMmin)');
  });
});
