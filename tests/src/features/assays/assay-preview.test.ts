import { describe, expect, it } from 'vitest';
import { fitAssay } from '@shared/assay/fit-assay';
import { assayPreview } from '@/features/assays/lib/assay-preview';
import type { GridPoint } from '@/features/assays/lib/point-grid';

// Puromycin, treated cells (Treloar 1974; Bates & Watts, Nonlinear Regression Analysis and Its Applications,
// 1988), as printed by R's nls: Vm = 212.6837431425 µM/min (SE 6.947), K = 0.06412128168 mM (SE 0.008281),
// read as mM and µM/min with [E]t = 10 nM, so kcat = Vm/[E]t = 21268.37 min⁻¹ = 354.4729 s⁻¹.
const S_MM = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const V_UM_PER_MIN = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const KCAT_PER_SECOND = 212.6837431425 / 0.01 / 60;
const KM_MOLAR = 0.06412128168e-3;

const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

function points(excludedIndex?: number): GridPoint[] {
  return S_MM.map((s, index) => ({
    key: `r${index}:${(index % 2) + 1}`,
    row: Math.floor(index / 2),
    replicate: (index % 2) + 1,
    x: s,
    y: V_UM_PER_MIN[index],
    excluded: index === excludedIndex,
    reason: index === excludedIndex ? 'outlier' : null,
  }));
}

const options = { sUnit: 'mM', vUnit: 'µM/min', enzymeConcentration: { value: 10, unit: 'nM' }, model: 'michaelis-menten' } as const;

describe('assayPreview', () => {
  it('fits the Puromycin data to the reference values', () => {
    const preview = assayPreview(points(), options);
    const fit = preview.chosen.fit!;
    expect(preview.chosen.error).toBeNull();
    expect(relative(fit.parameters.kcat.value, KCAT_PER_SECOND)).toBeLessThan(1e-6);
    expect(relative(fit.parameters.km.value, KM_MOLAR)).toBeLessThan(1e-6);
    expect(relative(fit.parameters.km.se, 0.008281e-3)).toBeLessThan(1e-3);
  });

  it('sends the points in grid order with their exclusions, and fits exactly what it sends', () => {
    const preview = assayPreview(points(1), options);
    expect(preview.requestPoints[1]).toEqual({ s: 0.02, v: 47, replicate: 2, excluded: true, exclusionReason: 'outlier' });
    // The server runs fitAssay on the body's points: the preview's numbers must be the same to the last bit.
    const server = fitAssay(preview.requestPoints, options);
    expect(preview.chosen.fit!.parameters).toEqual(server.parameters);
    expect(preview.chosen.fit!.pointCount).toBe(11);
  });

  it('compares Michaelis–Menten with substrate inhibition and Hill', () => {
    const preview = assayPreview(points(), options);
    expect(preview.comparisons.map((outcome) => outcome.model)).toEqual(['substrate-inhibition', 'hill']);
    for (const outcome of preview.comparisons) {
      expect(outcome.error).toBeNull();
      expect(outcome.comparison!.richer.rss).toBeLessThanOrEqual(outcome.comparison!.simpler.rss);
    }
  });

  it('flags a substrate range that starts above 0.2 × Km (common practice: span 0.2–5 Km)', () => {
    // Lowest S 0.02 mM against 0.2 × Km = 0.0128 mM.
    expect(assayPreview(points(), options).flags.map((flag) => flag.code)).toContain('range-does-not-span-km');
  });

  it('gives Vmax and Km without [E]t, and neither kcat flags nor plausibility without it', () => {
    const preview = assayPreview(points(), { ...options, enzymeConcentration: null });
    expect(preview.hasEnzyme).toBe(false);
    expect(preview.flags).toEqual([]);
    expect(relative(preview.chosen.fit!.parameters.km.value, KM_MOLAR)).toBeLessThan(1e-6);
  });

  it('says why there is no fit, in the engine’s words', () => {
    const preview = assayPreview(points().slice(0, 4), options);
    expect(preview.chosen.fit).toBeNull();
    expect(preview.chosen.error).toMatch(/at least three/);
  });
});
