import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { plausibilityFlags } from '../../../shared/kinetics/plausibility';

const codes = (input: Parameters<typeof plausibilityFlags>[0]) => plausibilityFlags(input).map((flag) => flag.code);

describe('plausibilityFlags', () => {
  // Thresholds from issue 3 and common practice: the diffusion limit is about 10⁸–10⁹ M⁻¹ s⁻¹
  // (Alberty & Hammes 1958, from memory); above 10¹⁰ is physically implausible.
  it('flags kcat/Km at or above 10⁸ M⁻¹ s⁻¹ as approaching the diffusion limit', () => {
    expect(codes({ kcatOverKmPerMolarSecond: { value: 9.9e7 } })).toEqual([]);
    expect(codes({ kcatOverKmPerMolarSecond: { value: 1e8 } })).toEqual(['near-diffusion-limit']);
    expect(codes({ kcatOverKmPerMolarSecond: { value: 1e10 } })).toEqual(['near-diffusion-limit']);
    expect(plausibilityFlags({ kcatOverKmPerMolarSecond: { value: 3e8 } })[0]).toEqual({
      code: 'near-diffusion-limit',
      severity: 'warning',
      message: 'kcat/Km of 3.00 × 10⁸ M⁻¹ s⁻¹ approaches the diffusion limit (10⁸–10⁹ M⁻¹ s⁻¹)',
    });
  });

  it('flags kcat/Km above 10¹⁰ M⁻¹ s⁻¹ as physically implausible', () => {
    const [flag] = plausibilityFlags({ kcatOverKmPerMolarSecond: { value: 2e10 } });
    expect(flag.code).toBe('above-diffusion-limit');
    expect(flag.severity).toBe('implausible');
  });

  it('flags a Km above the highest substrate concentration tested', () => {
    expect(codes({ kmMolar: { value: 2e-3 }, substrateMolar: [1e-4, 5e-4, 1e-3] })).toEqual([
      'km-above-range',
      'range-does-not-span-km',
    ]);
  });

  it('writes concentrations in the unit a bench scientist would, and rates in scientific notation', () => {
    const messages = plausibilityFlags({ kmMolar: { value: 2e-3 }, substrateMolar: [2e-5, 5e-4, 1.1e-3] }).map((flag) => flag.message);
    expect(messages).toEqual([
      'Km of 2 mM is above the highest substrate concentration tested (1.1 mM); Km and kcat are extrapolated',
      'the substrate range tested (20 µM to 1.1 mM) does not span 0.2–5 × Km (400 µM to 10 mM), so Km is poorly determined',
    ]);
    expect(plausibilityFlags({ kcatOverKmPerMolarSecond: { value: 2.5e10 } })[0].message).toContain('kcat/Km of 2.50 × 10¹⁰ M⁻¹ s⁻¹');
  });

  it('flags a substrate range that does not span 0.2–5 × Km, and not one that does', () => {
    // Km = 1 mM: 0.2 mM to 5 mM is needed.
    expect(codes({ kmMolar: { value: 1e-3 }, substrateMolar: [0, 2e-4, 1e-3, 5e-3] })).toEqual([]);
    expect(codes({ kmMolar: { value: 1e-3 }, substrateMolar: [0, 3e-4, 1e-3, 5e-3] })).toEqual(['range-does-not-span-km']);
    expect(codes({ kmMolar: { value: 1e-3 }, substrateMolar: [2e-4, 1e-3, 4e-3] })).toEqual(['range-does-not-span-km']);
  });

  it('flags every estimate whose relative standard error is above 50 %', () => {
    const flags = plausibilityFlags({
      kcatPerSecond: { value: 10, se: 6 },
      kmMolar: { value: 1e-3, se: 5e-4 },
      kcatOverKmPerMolarSecond: { value: 1e4, se: 1e4 },
    });
    expect(flags.map((flag) => flag.message)).toEqual([
      'kcat is poorly determined: its standard error is 60 % of its value',
      'kcat/Km is poorly determined: its standard error is 100 % of its value',
    ]);
  });

  it('refuses negative or non-finite values instead of flagging them', () => {
    expect(() => plausibilityFlags({ kmMolar: { value: -1e-3 } })).toThrow(
      new KineticsInputError('plausibilityFlags requires a finite, positive value (Km)'),
    );
    expect(() => plausibilityFlags({ kcatPerSecond: { value: 1, se: Number.POSITIVE_INFINITY } })).toThrow(
      new KineticsInputError('plausibilityFlags requires a finite, non-negative standard error (kcat)'),
    );
    expect(() => plausibilityFlags({ substrateMolar: [0, 0] })).toThrow(KineticsInputError);
    expect(() => plausibilityFlags({ substrateMolar: [1e-3, Number.NaN] })).toThrow(KineticsInputError);
  });
});
