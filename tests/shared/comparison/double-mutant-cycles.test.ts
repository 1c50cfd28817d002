import { describe, expect, it } from 'vitest';
import type { ComparableMeasurement } from '../../../shared/comparison/compare-with-parent';
import { doubleMutantCycles, type CycleVariant } from '../../../shared/comparison/double-mutant-cycles';

// Double-mutant cycle, ΔΔG_int = ΔΔG‡(AB) − ΔΔG‡(A) − ΔΔG‡(B) = −RT ln(k_AB·k_P/(k_A·k_B)) (Carter, Winter,
// Wilkinson & Fersht, Cell 38 (1984) 835; Horovitz, Folding & Design 1 (1996) R121), computed here by hand
// with R = 8.31446261815324 J mol⁻¹ K⁻¹ (CODATA 2018 exact); errors from the relative standard errors of
// the four rate constants (Taylor, An Introduction to Error Analysis, 2nd ed., §3.8). Invented values.
const R = 8.31446261815324;
const celsius = (value: number) => value + 273.15;

let nextId = 100;
function measured(kcatOverKm: [number, number], conditions: { temperatureC?: number; kcat?: [number, number] } = {}): ComparableMeasurement[] {
  return [
    {
      id: nextId++,
      substrate: 'pNP-acetate',
      temperatureKelvin: celsius(conditions.temperatureC ?? 37),
      ph: 6,
      kcatPerSecond: conditions.kcat ? { value: conditions.kcat[0], se: conditions.kcat[1] } : null,
      kmMolar: null,
      kcatOverKmPerMolarSecond: { value: kcatOverKm[0], se: kcatOverKm[1] },
    },
  ];
}

const s112a = { position: 112, from: 'S', to: 'A' };
const h190n = { position: 190, from: 'H', to: 'N' };
const d45e = { position: 45, from: 'D', to: 'E' };
const variantA: CycleVariant = { id: 2, label: 'S112A', mutations: [s112a] };
const variantB: CycleVariant = { id: 3, label: 'H190N', mutations: [h190n] };
const variantAB: CycleVariant = { id: 4, label: 'S112A/H190N', mutations: [s112a, h190n] };

describe('doubleMutantCycles', () => {
  it('gives the coupling energy and its error for a matched cycle, checked by hand', () => {
    const { cycles, unmatched } = doubleMutantCycles({
      variants: [variantA, variantB, variantAB],
      measurementsByVariant: new Map([
        [2, measured([1e3, 50], { kcat: [1, 0.1] })],
        [3, measured([2e3, 100], { kcat: [5, 0.5] })],
        [4, measured([1e3, 50], { kcat: [2, 0.2] })],
      ]),
      parentMeasurements: measured([1e4, 500], { kcat: [10, 1] }),
    });
    expect(unmatched).toEqual([]);
    expect(cycles).toHaveLength(1);
    const [cycle] = cycles;
    expect([cycle.combination.label, cycle.a.label, cycle.b.label]).toEqual(['S112A/H190N', 'S112A', 'H190N']);
    const rt = (R * celsius(37)) / 1000;
    // kcat/Km: ln(10³·10⁴/(10³·2·10³)) = ln 5; every relative error is 0.05 → se = RT·√(4·0.05²) = 0.1·RT.
    expect(cycle.kcatOverKm?.coupling.kJPerMol.value).toBeCloseTo(-rt * Math.log(5), 12);
    expect(cycle.kcatOverKm?.coupling.kJPerMol.se).toBeCloseTo(0.1 * rt, 12);
    expect(cycle.kcatOverKm?.ddgA.value).toBeCloseTo(-rt * Math.log(0.1), 12);
    expect(cycle.kcatOverKm?.ddgB.value).toBeCloseTo(-rt * Math.log(0.2), 12);
    expect(cycle.kcatOverKm?.ddgAB.value).toBeCloseTo(-rt * Math.log(0.1), 12);
    // Additive prediction −RT ln(k_A·k_B/k_P²); the parent's error enters twice: √(0.05² + 0.05² + 4·0.05²).
    expect(cycle.kcatOverKm?.predictedAdditive.value).toBeCloseTo(-rt * (Math.log(0.1) + Math.log(0.2)), 12);
    expect(cycle.kcatOverKm?.predictedAdditive.se).toBeCloseTo(rt * 0.05 * Math.sqrt(6), 12);
    // Observed − predicted is the coupling energy.
    expect((cycle.kcatOverKm?.ddgAB.value ?? 0) - (cycle.kcatOverKm?.predictedAdditive.value ?? 0)).toBeCloseTo(
      cycle.kcatOverKm?.coupling.kJPerMol.value ?? Number.NaN,
      12,
    );
    // kcat: ln(2·10/(1·5)) = ln 4, relative errors all 0.1 → se = 0.2·RT.
    expect(cycle.kcat?.coupling.kJPerMol.value).toBeCloseTo(-rt * Math.log(4), 12);
    expect(cycle.kcat?.coupling.kJPerMol.se).toBeCloseTo(0.2 * rt, 12);
  });

  it('is zero for additive mutations', () => {
    // A tenfold, B a hundredfold, AB a thousandfold below the parent: independent effects.
    const { cycles } = doubleMutantCycles({
      variants: [variantA, variantB, variantAB],
      measurementsByVariant: new Map([
        [2, measured([1e3, 10])],
        [3, measured([1e2, 1])],
        [4, measured([10, 0.1])],
      ]),
      parentMeasurements: measured([1e4, 100]),
    });
    expect(cycles[0].kcatOverKm?.coupling.kJPerMol.value).toBeCloseTo(0, 12);
  });

  it('lists a cycle whose corners were not measured under matched conditions, with no number', () => {
    const { cycles, unmatched } = doubleMutantCycles({
      variants: [variantA, variantB, variantAB],
      measurementsByVariant: new Map([
        [2, measured([1e3, 10])],
        [3, measured([1e2, 1], { temperatureC: 25 })],
        [4, measured([10, 0.1])],
      ]),
      parentMeasurements: measured([1e4, 100]),
    });
    expect(cycles).toEqual([]);
    expect(unmatched).toEqual([
      {
        combination: { id: 4, label: 'S112A/H190N' },
        a: { id: 2, label: 'S112A' },
        b: { id: 3, label: 'H190N' },
        reason:
          'the parent, S112A and H190N were not all measured under conditions matching a measurement of S112A/H190N (same substrate, within 0.5 °C and 0.1 pH)',
      },
    ]);
  });

  it('finds every split of a triple mutant whose parts were measured, each once', () => {
    const variantC: CycleVariant = { id: 5, label: 'D45E', mutations: [d45e] };
    const variantBC: CycleVariant = { id: 6, label: 'D45E/H190N', mutations: [d45e, h190n] };
    const variantABC: CycleVariant = { id: 7, label: 'D45E/S112A/H190N', mutations: [d45e, s112a, h190n] };
    const { cycles } = doubleMutantCycles({
      variants: [variantA, variantB, variantAB, variantC, variantBC, variantABC],
      measurementsByVariant: new Map([2, 3, 4, 5, 6, 7].map((id) => [id, measured([1e3, 10])])),
      parentMeasurements: measured([1e4, 100]),
    });
    expect(cycles.map((cycle) => `${cycle.combination.label} = ${cycle.a.label} + ${cycle.b.label}`)).toEqual([
      'D45E/H190N = D45E + H190N',
      'D45E/S112A/H190N = D45E + S112A/H190N',
      'D45E/S112A/H190N = D45E/H190N + S112A',
      'S112A/H190N = S112A + H190N',
    ]);
  });

  it('ignores combinations whose parts were never made', () => {
    const { cycles, unmatched } = doubleMutantCycles({
      variants: [variantA, variantAB],
      measurementsByVariant: new Map([
        [2, measured([1e3, 10])],
        [4, measured([10, 0.1])],
      ]),
      parentMeasurements: measured([1e4, 100]),
    });
    expect(cycles).toEqual([]);
    expect(unmatched).toEqual([]);
  });
});
