import { describe, expect, it } from 'vitest';
import { strendaCompleteness, type StrendaInput } from '../../../shared/reporting/strenda-completeness';

// Items from the STRENDA Guidelines (Beilstein-Institut, strenda.org): Level 1A "Data required for a
// complete description of an experiment" (version 1.5, 2008: enzyme name, EC number, organism, sequence
// accession; assay temperature, pH, buffer & concentrations, metal salts & concentrations, substrates &
// concentrations, enzyme concentration) and Level 1B (kinetic parameters with units and errors, number of
// replicates, model and fitting method; the 1B wording is summarised from memory).
const complete: StrendaInput = {
  enzymeName: 'Invented amidase',
  ecNumber: '3.5.1.4',
  organism: 'synthetic construct',
  sequence: 'MSTAV',
  temperatureKelvin: 310.15,
  ph: 6,
  bufferName: 'MES',
  bufferMolar: 0.05,
  metalCofactorRequired: true,
  metalSalt: 'ZnCl2',
  metalMolar: 1e-5,
  substrateMinMolar: 1e-4,
  substrateMaxMolar: 1e-2,
  enzymeMolar: 1e-8,
  kcat: { value: 10, se: 0.5 },
  km: { value: 1e-3, se: 1e-4 },
  replicateCount: 3,
  model: 'michaelis-menten',
  fittingMethod: 'nonlinear least squares',
};

describe('strendaCompleteness', () => {
  it('scores a fully described measurement 1 with nothing missing', () => {
    const result = strendaCompleteness(complete);
    expect(result.score).toBe(1);
    expect(result.missing).toEqual([]);
    expect(result.present).toHaveLength(13);
  });

  it('lists the Level 1A and 1B items that are missing, in the order of the guidelines', () => {
    const result = strendaCompleteness({
      ...complete,
      ecNumber: null,
      bufferMolar: null,
      enzymeMolar: null,
      km: { value: 1e-3, se: null },
      replicateCount: null,
      fittingMethod: ' ',
    });
    expect(result.missing).toEqual([
      'enzyme name and EC number',
      'buffer and its concentration',
      'enzyme concentration',
      'standard errors of kcat and Km',
      'number of replicates',
      'kinetic model and fitting method',
    ]);
    expect(result.score).toBeCloseTo(7 / 13, 12);
  });

  it('counts metal salts only for an enzyme that needs a metal ion', () => {
    const noMetal = { ...complete, metalSalt: null, metalMolar: null };
    expect(strendaCompleteness({ ...noMetal, metalCofactorRequired: true }).missing).toEqual(['metal salt and its concentration']);
    const withoutMetal = strendaCompleteness({ ...noMetal, metalCofactorRequired: false });
    expect(withoutMetal.score).toBe(1);
    expect(withoutMetal.present).toHaveLength(12);
  });

  it('accepts an accession in place of a sequence and wants a real range of substrate concentrations', () => {
    expect(strendaCompleteness({ ...complete, sequence: null, accession: 'P12345' }).missing).toEqual([]);
    expect(strendaCompleteness({ ...complete, substrateMinMolar: 1e-3, substrateMaxMolar: 1e-3 }).missing).toEqual([
      'substrate concentration range',
    ]);
  });

  it('scores an almost empty record low', () => {
    const result = strendaCompleteness({ metalCofactorRequired: false, temperatureKelvin: 298.15, ph: 7 });
    expect(result.present).toEqual(['assay temperature', 'assay pH']);
    expect(result.score).toBeCloseTo(2 / 12, 12);
  });
});
