import { describe, expect, it } from 'vitest';
import { fitAssay } from '../../../shared/assay/fit-assay';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';

/** |actual/expected − 1| ≤ tolerance: the "within 1e-6 relative" of the reference comparison. */
function expectRelative(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(tolerance);
}

// Puromycin, treated cells (Treloar 1974; Bates & Watts, Nonlinear Regression Analysis and Its
// Applications, 1988), as printed by R's nls for `Puromycin`: Vm = 212.6837431425 (SE 6.947),
// K = 0.06412128168 (SE 0.008281). The concentrations (ppm) are read here as mM and the rates (counts/min²)
// as µM/min, with [E]t = 10 nM, to check the conversion to SI: 1 mM = 10⁻³ M, 1 µM/min = 10⁻⁶/60 M s⁻¹
// (SI Brochure, 9th ed.).
const s = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const v = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const puromycin = s.map((si, index) => ({ s: si, v: v[index] }));
const VM = 212.6837431425;
const K = 0.06412128168;
const options = { model: 'michaelis-menten', sUnit: 'mM', vUnit: 'µM/min', enzymeConcentration: { value: 10, unit: 'nM' } } as const;

describe('fitAssay on the Puromycin data', () => {
  const result = fitAssay(puromycin, options);

  it('reports Vmax and Km in SI within 1e-6 of the reference fit', () => {
    expectRelative(result.parameters.vmax.value, ((VM * 1e-6) / 60), 1e-6);
    expectRelative(result.parameters.km.value, (K * 1e-3), 1e-6);
    expectRelative(result.parameters.vmax.se, ((6.947 * 1e-6) / 60), 1e-3);
    expectRelative(result.parameters.km.se, (0.008281 * 1e-3), 1e-3);
  });

  it('gives kcat = Vmax/[E]t in s⁻¹ and kcat/Km in M⁻¹ s⁻¹', () => {
    // Vmax/[E]t = 212.68 µM/min / 0.01 µM = 21268 min⁻¹ = 354.47 s⁻¹; kcat/Km = 354.47 s⁻¹ / 6.412e-5 M.
    const kcat = VM / 0.01 / 60;
    expectRelative(result.parameters.kcat.value, kcat, 1e-6);
    expectRelative(result.parameters.kcatOverKm!.value, (kcat / (K * 1e-3)), 1e-6);
    // Residual SE 10.93 on 10 degrees of freedom (the same reference output), in M s⁻¹.
    expectRelative(result.residualSdMolarPerSecond, ((10.93 * 1e-6) / 60), 1e-3);
    expect(result.degreesOfFreedom).toBe(10);
  });

  it('gives the same SI numbers when the same data are entered in other units', () => {
    // The same data as M and M/s (×10⁻³ and ×10⁻⁶/60), enzyme 1e-8 M.
    const inSi = fitAssay(
      puromycin.map((point) => ({ s: point.s * 1e-3, v: (point.v * 1e-6) / 60 })),
      { model: 'michaelis-menten', sUnit: 'M', vUnit: 'M/s', enzymeConcentration: { value: 1e-8, unit: 'M' } },
    );
    expectRelative(inSi.parameters.kcat.value, result.parameters.kcat.value, 1e-6);
    expectRelative(inSi.parameters.km.value, result.parameters.km.value, 1e-6);
  });

  it('leaves excluded points out of the fit', () => {
    const withOutlier = [...puromycin, { s: 0.3, v: 900, excluded: true }];
    const refit = fitAssay(withOutlier, options);
    expect(refit.pointCount).toBe(12);
    expect(refit.parameters.vmax.value).toBe(result.parameters.vmax.value);
  });

  it('throws the engine error for points it cannot fit', () => {
    expect(() => fitAssay([{ s: 1, v: 1 }, { s: 1, v: 2 }, { s: 1, v: 3 }], options)).toThrow(KineticsInputError);
  });
});
