import { describe, expect, it } from 'vitest';
import { assayBody, blankConditions, checkAssayBody, cleanRemembered, sortFieldMessages } from '@/features/assays/lib/assay-form';

const points = [0.05, 0.1, 0.2, 0.4].map((s, index) => ({ s, v: 10 * index + 5, replicate: 1, excluded: false, exclusionReason: null }));

function filled() {
  return { ...blankConditions(), variantId: '3', substrate: 'invented anilide', temperatureC: '45', ph: '5,5', bufferName: 'MES', bufferMm: '50', enzymeValue: '10', assayDate: '2026-03-02' };
}

describe('assayBody and checkAssayBody', () => {
  it('builds a body the shared schema accepts, with units and a decimal comma read', () => {
    const checked = checkAssayBody(assayBody(filled(), points));
    expect(checked.ok).toBe(true);
    if (!checked.ok) return;
    expect(checked.input.ph).toBe(5.5);
    expect(checked.input.buffer).toEqual({ name: 'MES', concentration: { value: 50, unit: 'mM' } });
    expect(checked.input.metal).toBeNull();
    expect(checked.input.enzymeConcentration).toEqual({ value: 10, unit: 'nM' });
  });

  it('puts the schema’s messages on the form’s fields and says "is required" for empty ones', () => {
    const values = { ...filled(), substrate: '', temperatureC: '400', bufferName: '', metalValue: '2' };
    const checked = checkAssayBody(assayBody(values, points));
    expect(checked.ok).toBe(false);
    if (checked.ok) return;
    const { byField, other } = sortFieldMessages(checked.fields, values);
    expect(byField.substrate).toBe('is required');
    expect(byField.temperatureC).toBe('must be between -20 and 150 °C');
    expect(byField.bufferName).toBe('is required');
    expect(byField.metalSalt).toBe('is required');
    expect(other).toEqual([]);
  });

  it('keeps point messages apart from the fields', () => {
    const values = filled();
    const checked = checkAssayBody(assayBody(values, points.slice(0, 2)));
    expect(checked.ok).toBe(false);
    if (checked.ok) return;
    expect(sortFieldMessages(checked.fields, values).other).toEqual(['Rate points: must contain at least three included points with distinct substrate concentrations.']);
  });
});

describe('cleanRemembered', () => {
  it('keeps remembered text fields and listed choices only', () => {
    expect(cleanRemembered({ substrate: 'x', sUnit: 'mM', vUnit: 'furlongs', variantId: '9', temperatureC: 45 })).toEqual({ substrate: 'x', sUnit: 'mM' });
    expect(cleanRemembered('not an object')).toEqual({});
  });
});
