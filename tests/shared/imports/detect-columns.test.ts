import { describe, expect, it } from 'vitest';
import { detectColumns } from '../../../shared/imports/detect-columns';

describe('detectColumns', () => {
  it('maps headers to fields with the units written in them', () => {
    const { columns } = detectColumns('measurements', ['Variant', 'Km (mM)', 'kcat [1/s]', 'kcat/Km (M-1 s-1)', 'Temperature (K)']);
    expect(columns).toEqual({
      variant: { column: 0 },
      km: { column: 1, unit: 'mM' },
      kcat: { column: 2, unit: '1/s' },
      kcatOverKm: { column: 3, unit: 'M⁻¹ s⁻¹' },
      temperature: { column: 4, unit: 'K' },
    });
  });

  it('gives a bare SE or ± column to the value just before it, in its unit', () => {
    const { columns } = detectColumns('measurements', ['kcat (1/min)', '±', 'Km (µM)', 'SE']);
    expect(columns).toEqual({ kcat: { column: 0, unit: '1/min' }, kcatSe: { column: 1, unit: '1/min' }, km: { column: 2, unit: 'µM' }, kmSe: { column: 3, unit: 'µM' } });
  });

  it('tells a name from a concentration by the unit: Substrate and Substrate (mM), Buffer and Buffer (mM)', () => {
    expect(detectColumns('rate-points', ['Substrate', 'Substrate (mM)', 'Rate (uM/min)']).columns).toEqual({
      substrate: { column: 0 },
      s: { column: 1, unit: 'mM' },
      v: { column: 2, unit: 'µM/min' },
    });
    expect(detectColumns('measurements', ['Buffer (mM)', 'Buffer']).columns).toEqual({ bufferConcentration: { column: 0, unit: 'mM' }, bufferName: { column: 1 } });
  });

  it('leaves a header whose unit it cannot read unitless, for the mapping to ask', () => {
    expect(detectColumns('measurements', ['Km (mg/mL)']).columns).toEqual({ km: { column: 0 } });
  });

  it('offers a remembered mapping first, taking the header’s unit over the remembered one', () => {
    const remembered = { kcat: { header: 'Turnover', unit: '1/min' }, km: { header: 'Affinity (mM)', unit: 'µM' } };
    const { columns, source } = detectColumns('measurements', ['turnover', 'Affinity (mM)', 'Km (µM)'], remembered);
    expect(columns).toEqual({ kcat: { column: 0, unit: '1/min' }, km: { column: 1, unit: 'mM' } });
    expect(source).toEqual({ kcat: 'saved', km: 'saved' });
  });

  it('never maps one column to two fields, nor one field to two columns', () => {
    const { columns } = detectColumns('variants', ['Mutations', 'Variant', 'Mutations']);
    expect(columns).toEqual({ mutations: { column: 0 } });
  });
});
