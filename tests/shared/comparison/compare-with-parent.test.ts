import { describe, expect, it } from 'vitest';
import { compareWithParent, type ComparableMeasurement } from '../../../shared/comparison/compare-with-parent';

// ΔΔG‡ = −RT ln(k_variant/k_parent) (Fersht, Structure and Mechanism in Protein Science, 1999, ch. 15),
// computed here by hand with R = 8.31446261815324 J mol⁻¹ K⁻¹ (CODATA 2018, exact since the 2019 SI);
// errors by propagating relative standard errors (Taylor, An Introduction to Error Analysis, 2nd ed.,
// §3.8); replicates by inverse-variance weighting (Taylor §7.2). The measurements are invented.
const R = 8.31446261815324;
const celsius = (value: number) => value + 273.15;
const target = { substrate: 'pNP-acetate', temperatureKelvin: celsius(37), ph: 6 };

let nextId = 1;
function measurement(
  conditions: { substrate?: string; temperatureC?: number; ph?: number },
  rates: { kcat?: [number, number]; km?: [number, number]; kcatOverKm?: [number, number] },
): ComparableMeasurement {
  const pair = (value?: [number, number]) => (value ? { value: value[0], se: value[1] } : null);
  return {
    id: nextId++,
    substrate: conditions.substrate ?? 'pNP-acetate',
    temperatureKelvin: celsius(conditions.temperatureC ?? 37),
    ph: conditions.ph ?? 6,
    kcatPerSecond: pair(rates.kcat),
    kmMolar: pair(rates.km),
    kcatOverKmPerMolarSecond: pair(rates.kcatOverKm),
  };
}

describe('compareWithParent under matched conditions', () => {
  const parent = [measurement({}, { kcat: [10, 0.5], km: [1e-3, 1e-4], kcatOverKm: [1e4, 500] })];

  it('gives ΔΔG‡ for kcat/Km and kcat, fold change and Km ratio, checked against the formula', () => {
    const variant = [measurement({ temperatureC: 37.3, ph: 6.05 }, { kcat: [2, 0.2], km: [2e-3, 2e-4], kcatOverKm: [1e3, 50] })];
    const { primary, comparisons } = compareWithParent(variant, parent, target);
    expect(comparisons).toHaveLength(1);
    const temperature = celsius(37.3);
    const rt = (R * temperature) / 1000;
    // kcat/Km: 1000 ± 50 against 10000 ± 500 → −RT ln 0.1, se RT·√(0.05² + 0.05²).
    expect(primary?.ddgKcatOverKm?.kJPerMol.value).toBeCloseTo(-rt * Math.log(1000 / 10000), 12);
    expect(primary?.ddgKcatOverKm?.kJPerMol.se).toBeCloseTo(rt * Math.sqrt(0.05 ** 2 + 0.05 ** 2), 12);
    // 1 kcal = 4.184 kJ (thermochemical calorie).
    expect(primary?.ddgKcatOverKm?.kcalPerMol.value).toBeCloseTo((-rt * Math.log(0.1)) / 4.184, 12);
    // kcat: 2 ± 0.2 against 10 ± 0.5 → −RT ln 0.2, se RT·√(0.1² + 0.05²).
    expect(primary?.ddgKcat?.kJPerMol.value).toBeCloseTo(-rt * Math.log(0.2), 12);
    expect(primary?.ddgKcat?.kJPerMol.se).toBeCloseTo(rt * Math.sqrt(0.1 ** 2 + 0.05 ** 2), 12);
    expect(primary?.foldChangeKcatOverKm?.value).toBeCloseTo(0.1, 14);
    expect(primary?.foldChangeKcatOverKm?.se).toBeCloseTo(0.1 * Math.sqrt(0.05 ** 2 + 0.05 ** 2), 14);
    expect(primary?.kmRatio?.value).toBeCloseTo(2, 14);
    expect(primary?.kmRatio?.se).toBeCloseTo(2 * Math.sqrt(0.1 ** 2 + 0.1 ** 2), 14);
    expect(primary?.reason).toBeNull();
    expect(primary?.parentMeasurementIds).toEqual([parent[0].id]);
  });

  it('is +5.708 kJ/mol for a tenfold slower variant at 25 °C', () => {
    // RT ln 10 at 298.15 K = 5.7080095 kJ/mol, the common-practice "1.36 kcal/mol per tenfold" rule.
    const parentAt25 = [measurement({ temperatureC: 25 }, { kcatOverKm: [1e4, 100] })];
    const variant = [measurement({ temperatureC: 25 }, { kcatOverKm: [1e3, 10] })];
    const { primary } = compareWithParent(variant, parentAt25, target);
    expect(primary?.ddgKcatOverKm?.kJPerMol.value).toBeCloseTo(5.7080095, 6);
    expect(primary?.ddgKcatOverKm?.kcalPerMol.value).toBeCloseTo(1.364247, 5);
  });

  it('combines replicates by inverse-variance weighting and uses the mean assay temperature', () => {
    const variant = [
      measurement({ temperatureC: 37 }, { kcatOverKm: [1000, 100] }),
      measurement({ temperatureC: 37.2 }, { kcatOverKm: [1200, 200] }),
    ];
    const { primary } = compareWithParent(variant, parent, target);
    // w = 1/100² and 1/200²: mean = (1000/10⁴ + 1200/(4·10⁴))/(1/10⁴ + 1/(4·10⁴)) = 1040; se = 1/√(1.25·10⁻⁴) = 89.4427.
    expect(primary?.variant.kcatOverKmPerMolarSecond?.value).toBeCloseTo(1040, 9);
    expect(primary?.variant.kcatOverKmPerMolarSecond?.se).toBeCloseTo(89.44271909999159, 9);
    expect(primary?.variant.kcatOverKmPerMolarSecond?.n).toBe(2);
    const temperature = celsius(37.1);
    expect(primary?.temperatureKelvin).toBeCloseTo(temperature, 12);
    const rt = (R * temperature) / 1000;
    expect(primary?.ddgKcatOverKm?.kJPerMol.value).toBeCloseTo(-rt * Math.log(1040 / 1e4), 12);
    expect(primary?.ddgKcatOverKm?.kJPerMol.se).toBeCloseTo(rt * Math.hypot(89.44271909999159 / 1040, 500 / 1e4), 12);
  });

  it('combines the matched parent replicates too, leaving out the unmatched ones', () => {
    const parents = [
      measurement({}, { kcatOverKm: [1e4, 1000] }),
      measurement({ temperatureC: 37.4 }, { kcatOverKm: [1.2e4, 1000] }),
      measurement({ temperatureC: 30 }, { kcatOverKm: [5e3, 100] }),
    ];
    const { primary } = compareWithParent([measurement({}, { kcatOverKm: [1e3, 100] })], parents, target);
    expect(primary?.parentMeasurementIds).toEqual([parents[0].id, parents[1].id]);
    // Equal weights: mean 11000, se 1000/√2.
    expect(primary?.parent?.kcatOverKmPerMolarSecond?.value).toBeCloseTo(11000, 9);
    expect(primary?.parent?.kcatOverKmPerMolarSecond?.se).toBeCloseTo(1000 / Math.SQRT2, 9);
  });
});

describe('compareWithParent without a matched parent', () => {
  it('says why and gives no number', () => {
    const parentAt25 = [measurement({ temperatureC: 25 }, { kcatOverKm: [1e4, 100] })];
    const { primary } = compareWithParent([measurement({}, { kcatOverKm: [1e3, 10] })], parentAt25, target);
    expect(primary?.reason).toBe('no parent measurement with substrate pNP-acetate within 0.5 °C and 0.1 pH of 37.0 °C, pH 6.0');
    expect(primary?.parent).toBeNull();
    expect(primary?.ddgKcatOverKm).toBeNull();
    expect(primary?.ddgKcat).toBeNull();
    expect(primary?.foldChangeKcatOverKm).toBeNull();
    expect(primary?.kmRatio).toBeNull();
  });

  it('does not match a parent 0.6 °C or 0.15 pH away, nor another substrate', () => {
    const variant = [measurement({}, { kcatOverKm: [1e3, 10] })];
    for (const parentConditions of [{ temperatureC: 37.6 }, { ph: 6.15 }, { substrate: 'pNP-butyrate' }]) {
      const { primary } = compareWithParent(variant, [measurement(parentConditions, { kcatOverKm: [1e4, 100] })], target);
      expect(primary?.parent).toBeNull();
    }
  });

  it('wants a parent measurement that matches every replicate of the group', () => {
    // 36.8 and 37.2 °C form one group (0.4 apart); a parent at 37.6 °C matches the second only.
    const variant = [measurement({ temperatureC: 36.8 }, { kcatOverKm: [1e3, 10] }), measurement({ temperatureC: 37.2 }, { kcatOverKm: [1e3, 10] })];
    const { comparisons } = compareWithParent(variant, [measurement({ temperatureC: 37.6 }, { kcatOverKm: [1e4, 100] })], target);
    expect(comparisons).toHaveLength(1);
    expect(comparisons[0].parent).toBeNull();
    expect(comparisons[0].reason).toBe(
      'no parent measurement with substrate pNP-acetate within 0.5 °C and 0.1 pH of each of the 2 variant measurements (36.8–37.2 °C, pH 6.0)',
    );
  });

  it('says so when the parent has no measurements at all', () => {
    const { primary } = compareWithParent([measurement({}, { kcatOverKm: [1e3, 10] })], [], target);
    expect(primary?.reason).toBe('the parent has no measurements to compare with');
  });

  it('returns no primary comparison for a variant without measurements', () => {
    expect(compareWithParent([], [measurement({}, { kcatOverKm: [1e4, 100] })], target)).toEqual({ comparisons: [], primary: null });
  });
});

describe('compareWithParent primary comparison', () => {
  const parents = [
    measurement({ temperatureC: 25, ph: 7 }, { kcatOverKm: [2e4, 200] }),
    measurement({ temperatureC: 37, ph: 7 }, { kcatOverKm: [3e4, 300] }),
    measurement({ substrate: 'pNP-butyrate' }, { kcatOverKm: [5e3, 50] }),
  ];

  it('prefers the target substrate, then a group with a comparison, then the nearest conditions', () => {
    const variant = [
      measurement({ substrate: 'pNP-butyrate' }, { kcatOverKm: [500, 5] }),
      measurement({ temperatureC: 25, ph: 7 }, { kcatOverKm: [2e3, 20] }),
      measurement({}, { kcatOverKm: [1e3, 10] }),
      measurement({ temperatureC: 37, ph: 7 }, { kcatOverKm: [3e3, 30] }),
    ];
    const { comparisons, primary } = compareWithParent(variant, parents, target);
    // 37 °C pH 7 is 10 tolerances from the target (ΔpH 1 = 10 × 0.1); 25 °C pH 7 is √(24² + 10²) = 26.
    // 37 °C pH 6 is the target itself but has no matched parent; the other substrate comes last.
    expect(comparisons.map((comparison) => [comparison.substrate, comparison.temperatureKelvin - 273.15, comparison.ph])).toEqual([
      ['pNP-acetate', expect.closeTo(37, 9), 7],
      ['pNP-acetate', expect.closeTo(25, 9), 7],
      ['pNP-acetate', expect.closeTo(37, 9), 6],
      ['pNP-butyrate', expect.closeTo(37, 9), 6],
    ]);
    expect(primary).toBe(comparisons[0]);
    expect(comparisons[0].targetDistance).toBeCloseTo(10, 9);
    expect(comparisons[1].targetDistance).toBeCloseTo(26, 9);
    expect(comparisons[2].targetDistance).toBeCloseTo(0, 9);
  });
});

describe('compareWithParent edge cases', () => {
  it('leaves out a value without a finite standard error and says so', () => {
    const parent = [measurement({}, { kcatOverKm: [1e4, 100] })];
    const unusable = measurement({}, { kcatOverKm: [5e3, Number.POSITIVE_INFINITY] });
    const usable = measurement({}, { kcatOverKm: [1e3, 10] });
    const { primary } = compareWithParent([unusable, usable], parent, target);
    expect(primary?.variant.kcatOverKmPerMolarSecond).toEqual({ value: 1e3, se: 10, n: 1 });
    expect(primary?.notes).toContain(
      `kcat/Km of variant measurement ${unusable.id} is left out: it needs a positive value and a finite standard error`,
    );
  });

  it('notes a missing kcat while still comparing kcat/Km', () => {
    const parent = [measurement({}, { kcatOverKm: [1e4, 100] })];
    const { primary } = compareWithParent([measurement({}, { kcat: [1, 0.1], kcatOverKm: [1e3, 10] })], parent, target);
    expect(primary?.ddgKcatOverKm).not.toBeNull();
    expect(primary?.ddgKcat).toBeNull();
    expect(primary?.notes).toContain('no ΔΔG‡ for kcat: the matched parent has no usable kcat under these conditions');
  });

  it('compares the parent with itself as the reference: ratio 1, ΔΔG‡ 0', () => {
    const own = [measurement({}, { kcat: [10, 1], kcatOverKm: [1e4, 100] })];
    const { primary } = compareWithParent(own, own, target, { variantIsParent: true });
    expect(primary?.foldChangeKcatOverKm).toEqual({ value: 1, se: 0 });
    expect(primary?.ddgKcatOverKm?.kJPerMol).toEqual({ value: 0, se: 0 });
    expect(primary?.ddgKcat?.kJPerMol).toEqual({ value: 0, se: 0 });
  });
});
