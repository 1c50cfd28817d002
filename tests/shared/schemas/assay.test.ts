import { describe, expect, it } from 'vitest';
import {
  createAssayInput,
  createMeasurementInput,
  fromMolarPerSecond,
  toMolar,
  toMolarPerSecond,
  toPerMolarPerSecond,
  toPerSecond,
} from '../../../shared/schemas/assay';

// Unit factors from the SI prefixes and the minute (SI Brochure, 9th ed., 2019, tables 7 and 8:
// m = 10⁻³, µ = 10⁻⁶, n = 10⁻⁹; 1 min = 60 s).
describe('units at the edge', () => {
  it('converts concentrations to molar, accepting uM and the Greek mu', () => {
    expect(toMolar(250, 'µM')).toBe(2.5e-4);
    expect(toMolar(250, 'uM')).toBe(2.5e-4);
    expect(toMolar(250, 'μM')).toBe(2.5e-4);
    expect(toMolar(3, 'mM')).toBe(3e-3);
    expect(toMolar(20, 'nM')).toBe(2e-8);
  });

  it('converts rates (concentration per time) to M/s and back', () => {
    expect(toMolarPerSecond(60, 'µM/min')).toBeCloseTo(1e-6, 20);
    expect(toMolarPerSecond(1, 'mM/s')).toBe(1e-3);
    expect(toMolarPerSecond(120, 'nM/min')).toBeCloseTo(2e-9, 22);
    expect(fromMolarPerSecond(1e-6, 'µM/min')).toBeCloseTo(60, 12);
  });

  it('converts kcat and kcat/Km units', () => {
    expect(toPerSecond(600, '1/min')).toBeCloseTo(10, 12);
    expect(toPerSecond(5, 's⁻¹')).toBe(5);
    expect(toPerMolarPerSecond(5, 'mM⁻¹ s⁻¹')).toBe(5000);
    expect(toPerMolarPerSecond(6, '1/(µM*min)')).toBeCloseTo(1e5, 8);
    expect(toPerMolarPerSecond(2, 'M⁻¹ s⁻¹')).toBe(2);
  });
});

const conditions = {
  variantId: 1,
  substrate: 'pNP-acetate',
  temperatureC: 37,
  ph: 6,
  buffer: { name: 'MES', concentration: { value: 50, unit: 'mM' } },
  assayDate: '2026-03-02',
};

describe('createAssayInput', () => {
  const points = [0.1, 0.2, 0.5, 1, 2, 5].map((s) => ({ s, v: s / (1 + s) }));

  it('accepts a well-formed assay and fills defaults', () => {
    const parsed = createAssayInput.parse({
      ...conditions,
      enzymeConcentration: { value: 10, unit: 'nM' },
      points,
      sUnit: 'mM',
      vUnit: 'µM/min',
      model: 'michaelis-menten',
    });
    expect(parsed.points[0]).toMatchObject({ replicate: 1, excluded: false, exclusionReason: null });
  });

  it('refuses negative and missing values with field messages', () => {
    const result = createAssayInput.safeParse({
      ...conditions,
      temperatureC: 400,
      ph: 15,
      enzymeConcentration: { value: -1, unit: 'nM' },
      points: [{ s: -1, v: 1 }, { s: 1, v: -2 }, { s: 2, v: 1, excluded: true }],
      sUnit: 'mol',
      vUnit: 'mM',
      model: 'linear',
    });
    expect(result.success).toBe(false);
    const fields = Object.fromEntries(result.error!.issues.map((issue) => [issue.path.join('.'), issue.message]));
    expect(fields).toMatchObject({
      temperatureC: 'must be between -20 and 150 °C',
      ph: 'must be between 0 and 14',
      'enzymeConcentration.value': 'must be greater than 0',
      'points.0.s': 'must be at least 0',
      'points.1.v': 'must be at least 0',
      sUnit: 'must be one of M, mM, µM, uM, μM, nM',
      vUnit: 'must be a concentration per time such as µM/min, mM/s or nM/min',
      model: 'must be one of michaelis-menten, substrate-inhibition, hill',
    });
  });

  it('wants a reason for an excluded point and enough included points for the model', () => {
    const result = createAssayInput.safeParse({
      ...conditions,
      enzymeConcentration: { value: 10, unit: 'nM' },
      points: [{ s: 1, v: 1 }, { s: 2, v: 1.5 }, { s: 4, v: 1.8, excluded: true }, { s: 8, v: 2 }],
      sUnit: 'mM',
      vUnit: 'µM/min',
      model: 'hill',
    });
    const fields = Object.fromEntries(result.error!.issues.map((issue) => [issue.path.join('.'), issue.message]));
    expect(fields).toEqual({
      'points.2.exclusionReason': 'is required when a point is excluded',
      points: 'must contain at least four included points with distinct substrate concentrations',
    });
  });

  it('refuses non-finite numbers and an impossible date', () => {
    const result = createAssayInput.safeParse({
      ...conditions,
      assayDate: '2026-02-30',
      enzymeConcentration: { value: Number.POSITIVE_INFINITY, unit: 'nM' },
      points: [{ s: Number.NaN, v: 1 }],
      sUnit: 'mM',
      vUnit: 'µM/min',
      model: 'michaelis-menten',
    });
    const fields = Object.fromEntries(result.error!.issues.map((issue) => [issue.path.join('.'), issue.message]));
    expect(fields).toMatchObject({
      assayDate: 'is not a calendar date',
      'enzymeConcentration.value': 'must be a finite number',
      'points.0.s': 'must be a finite number',
    });
  });
});

describe('createMeasurementInput', () => {
  it('wants kcat and Km with positive standard errors and units', () => {
    const result = createMeasurementInput.safeParse({
      ...conditions,
      kcat: { value: 10, se: 0, unit: '1/s' },
      km: { value: -1, se: 0.1, unit: 'furlong' },
    });
    const fields = Object.fromEntries(result.error!.issues.map((issue) => [issue.path.join('.'), issue.message]));
    expect(fields).toEqual({
      'kcat.se': 'must be greater than 0 (give the reported standard error)',
      'km.value': 'must be greater than 0',
      'km.unit': 'must be one of M, mM, µM, uM, μM, nM',
    });
  });

  it('keeps Ki to the substrate-inhibition model', () => {
    const result = createMeasurementInput.safeParse({
      ...conditions,
      kcat: { value: 10, se: 1, unit: '1/s' },
      km: { value: 1, se: 0.1, unit: 'mM' },
      ki: { value: 5, se: 1, unit: 'mM' },
    });
    expect(result.error?.issues.map((issue) => [issue.path.join('.'), issue.message])).toEqual([
      ['ki', 'belongs to the substrate-inhibition model only'],
    ]);
  });
});
