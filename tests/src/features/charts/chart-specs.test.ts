import type { Spec } from 'vega';
import type { TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { fitMichaelisMenten } from '@shared/kinetics/fit-michaelis-menten';
import { fittedCurve } from '@/features/charts/fitted-curve';
import { additivitySpec } from '@/features/charts/specs/additivity-spec';
import { colourSpan, heatMapSpec, NOT_COMPARED_LABEL } from '@/features/charts/specs/heat-map-spec';
import { kcatKmScatterSpec, kmDisplayUnit } from '@/features/charts/specs/kcat-km-scatter-spec';
import { michaelisMentenSpec } from '@/features/charts/specs/michaelis-menten-spec';
import { parentComparisonSpec } from '@/features/charts/specs/parent-comparison-spec';
import { phOptimumShiftSpec } from '@/features/charts/specs/ph-optimum-shift-spec';
import { phProfileSpec } from '@/features/charts/specs/ph-profile-spec';
import { residualsSpec } from '@/features/charts/specs/residuals-spec';
import { linearGrid } from '@/features/charts/specs/spec-parts';
import { renderSpec } from './render-spec';

// Puromycin, treated cells (Bates & Watts 1988): the reference fit is Vm = 212.68, K = 0.06412 (R nls).
const S_MM = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const V = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const puromycin = fitMichaelisMenten(S_MM.map((s, index) => ({ s, v: V[index] })));
const ratePoints = S_MM.map((s, index) => ({ key: String(index), s, v: V[index], replicate: (index % 2) + 1, excluded: index === 1, reason: index === 1 ? 'outlier' : null }));

type AnyRecord = Record<string, unknown>;

/** Every layer's inline data values, depth first. */
function layerValues(spec: TopLevelSpec | AnyRecord): AnyRecord[][] {
  return dataOf(spec as unknown as AnyRecord);
}

function dataOf(spec: AnyRecord): AnyRecord[][] {
  const own = (spec.data as { values?: AnyRecord[] } | undefined)?.values;
  const children = [...((spec.layer as AnyRecord[]) ?? []), ...((spec.vconcat as AnyRecord[]) ?? []), ...((spec.hconcat as AnyRecord[]) ?? [])];
  return [...(own ? [own] : []), ...children.flatMap(dataOf)];
}

/** Titles of every axis in the compiled Vega spec. */
function axisTitles(vega: Spec): string[] {
  const titles: string[] = [];
  const walk = (node: { axes?: { title?: unknown }[]; marks?: unknown[] }) => {
    for (const axis of node.axes ?? []) if (typeof axis.title === 'string') titles.push(axis.title);
    for (const mark of (node.marks ?? []) as { axes?: { title?: unknown }[]; marks?: unknown[] }[]) walk(mark);
  };
  walk(vega as never);
  return titles;
}

function legendCount(vega: Spec): number {
  let count = 0;
  const walk = (node: { legends?: unknown[]; marks?: unknown[] }) => {
    count += node.legends?.length ?? 0;
    for (const mark of (node.marks ?? []) as { legends?: unknown[]; marks?: unknown[] }[]) walk(mark);
  };
  walk(vega as never);
  return count;
}

/** Renders without code generation and checks what every chart must have: a title, axis titles, a legend, tooltips. */
async function expectCompleteChart(spec: TopLevelSpec, axisUnits: readonly string[], datasets?: Record<string, readonly object[]>) {
  const { svg, vega, warnings } = await renderSpec(spec, datasets);
  // Charts that fill their container cannot find one here, and Vega-Lite says a container-wide chart with
  // one row per category keeps its own height; anything else it warns about is a defect.
  expect(warnings.filter((warning) => !/event source: window|Dropping "fit-y" because spec has discrete height/.test(warning))).toEqual([]);
  expect(svg.startsWith('<svg')).toBe(true);
  expect(typeof spec.title === 'object' && spec.title !== null && 'text' in spec.title && spec.title.text).toBeTruthy();
  const titles = axisTitles(vega);
  for (const unit of axisUnits) expect(titles.some((title) => title.includes(unit))).toBe(true);
  expect(legendCount(vega)).toBeGreaterThan(0);
  expect(JSON.stringify(vega)).toContain('"tooltip"');
  return { svg, vega };
}

describe('fittedCurve', () => {
  it('gives the curve with its band, Vmax/2 at S = Km (confidence-band example)', () => {
    const curve = fittedCurve(puromycin, [0.06412128168]);
    expect(curve.hasBand).toBe(true);
    expect(curve.points[0].y).toBeCloseTo(106.3418, 3);
    expect(curve.points[0].lower).toBeLessThan(curve.points[0].y);
  });

  it('still draws the curve of a fit without a finite covariance, without a band', () => {
    const singular = { ...puromycin, covariance: puromycin.covariance.map((row) => row.map(() => Number.POSITIVE_INFINITY)) };
    const curve = fittedCurve(singular, [0.06412128168]);
    expect(curve.hasBand).toBe(false);
    expect(curve.points[0].y).toBeCloseTo(106.3418, 3);
    expect(curve.points[0].lower).toBe(curve.points[0].y);
  });
});

describe('assay charts', () => {
  it('draws the Michaelis–Menten plot with replicates, the excluded point, the fit and its band', async () => {
    const curve = fittedCurve(puromycin, linearGrid(0, 1.2, 50));
    const { spec, datasets } = michaelisMentenSpec({ title: 'Puromycin', points: ratePoints, curve: curve.points, hasBand: true, curveLabel: 'Michaelis–Menten fit', sUnit: 'mM', vUnit: 'µM/min', clickable: true });
    const { vega, svg } = await expectCompleteChart(spec, ['[S] (mM)', 'v₀ (µM/min)'], datasets);
    // Every point is drawn, the excluded one as well.
    expect(svg.match(/Status: /g)).toHaveLength(12);
    const domain = JSON.stringify(vega.scales ?? []);
    for (const series of ['Replicate 1', 'Replicate 2', 'Excluded', 'Michaelis–Menten fit', '95 % confidence band']) expect(domain).toContain(series);
    const band = datasets.band as AnyRecord[];
    expect(band.every((point) => (point.lower as number) <= (point.y as number) && (point.y as number) <= (point.upper as number))).toBe(true);
  });

  it('draws residuals that are the fit’s own residuals for the points in it', async () => {
    const atPoints = fittedCurve(puromycin, S_MM).points;
    const points = ratePoints.map((point, index) => ({ ...point, excluded: false, residual: point.v - atPoints[index].y }));
    const { spec, datasets } = residualsSpec({ title: 'Residuals', points, sUnit: 'mM', vUnit: 'µM/min', clickable: false });
    await expectCompleteChart(spec, ['[S] (mM)', 'µM/min'], datasets);
    points.forEach((point, index) => expect(point.residual).toBeCloseTo(puromycin.residuals[index], 8));
  });

  it('marks fitted pKa values and the optimum on a pH profile', async () => {
    const { spec, datasets } = phProfileSpec({
      title: 'pH profile',
      points: [4, 5, 6, 7, 8, 9].map((ph, index) => ({ key: String(index), ph, k: 1 / (1 + 10 ** (5 - ph) + 10 ** (ph - 8)), excluded: false })),
      curve: linearGrid(4, 9, 20).map((x) => ({ x, y: 1, lower: 0.9, upper: 1.1 })),
      hasBand: true,
      curveLabel: 'Bell-shaped fit',
      rateTitle: 'kcat/Km (M⁻¹ s⁻¹)',
      pkas: [
        { label: 'pKa1', value: 5, se: 0.05 },
        { label: 'pKa2', value: 8, se: null },
      ],
      optimum: { label: 'pH optimum', value: 6.5, se: 0.04 },
      clickable: false,
    });
    const { svg } = await expectCompleteChart(spec, ['pH', 'kcat/Km (M⁻¹ s⁻¹)'], datasets);
    expect(svg).toContain('pKa1 5.00 ± 0.05');
    expect(svg).toContain('pKa2 8.00');
    expect(svg).toContain('pH optimum 6.50 ± 0.04');
  });

  it('sets the variant against its parent on log axes with one panel per parameter', async () => {
    const spec = parentComparisonSpec({
      title: 'Y87F against parent',
      variantLabel: 'Y87F',
      parentLabel: 'parent',
      parameters: [
        { name: 'kcat', unit: 's⁻¹', factor: 1, variant: { value: 9, se: 1, n: 2 }, parent: { value: 11, se: 0.5, n: 3 } },
        { name: 'Km', unit: 'mM', factor: 1e3, variant: { value: 1.1e-3, se: 1e-4, n: 2 }, parent: { value: 1e-3, se: 5e-5, n: 3 } },
        { name: 'kcat/Km', unit: 'M⁻¹ s⁻¹', factor: 1, variant: { value: 8200, se: 900, n: 2 }, parent: null },
      ],
    });
    const { vega } = await expectCompleteChart(spec, ['kcat (s⁻¹)', 'Km (mM)', 'kcat/Km (M⁻¹ s⁻¹)']);
    expect(JSON.stringify(vega.scales ?? []) + JSON.stringify(vega)).toContain('"type":"log"');
    // Display units: 1.1 × 10⁻³ M is 1.1 mM.
    expect(layerValues(spec)[1][0].value).toBeCloseTo(1.1, 10);
  });
});

describe('heat map', () => {
  const aminoAcids = [...'ACDEFGHIKLMNPQRSTVWY*'];
  const positions = Array.from({ length: 500 }, (_, index) => ({ position: index + 1, parentResidue: aminoAcids[index % 20], catalyticRoles: index % 61 === 0 ? ['nucleophile'] : [] }));
  const cells = positions.flatMap((position) =>
    aminoAcids
      .filter((residue) => residue !== position.parentResidue && residue !== '*')
      .map((to, index) => ({
        position: position.position,
        to,
        variantId: position.position * 100 + index,
        label: `${position.parentResidue}${position.position}${to}`,
        status: 'characterized',
        measurementCount: index % 3 === 0 ? 0 : 1,
        foldChange: index % 3 === 0 ? null : 10 ** Math.sin(position.position * index),
        log10FoldChange: index % 3 === 0 ? null : Math.sin(position.position * index),
        ddgKjPerMol: index % 3 === 0 ? null : -5.9 * Math.sin(position.position * index),
      })),
  );

  it('spans the colour scale over the 90th percentile of |log10 fold change|, in half decades from 1 to 4', () => {
    expect(colourSpan([])).toBe(1);
    expect(colourSpan([0.1, -0.2, 0.3])).toBe(1);
    expect(colourSpan(Array.from({ length: 100 }, (_, index) => (index < 95 ? 1.2 : -9)))).toBe(1.5);
    expect(colourSpan(Array.from({ length: 100 }, (_, index) => (index < 85 ? -1.2 : 9)))).toBe(4);
    expect(colourSpan(Array.from({ length: 100 }, () => -1.7))).toBe(2);
  });

  it('draws 500 positions × 19 substitutions: coloured, grey and parent cells, catalytic positions marked', async () => {
    const { spec, datasets } = heatMapSpec({ title: 'Landscape', aminoAcids, positions, cells, parentVariantId: 7 });
    const { vega } = await expectCompleteChart(spec, ['Position', 'Substituted residue'], datasets);
    const [strip, notCompared, measured, parents] = [datasets.catalytic, datasets.notCompared, datasets.measured, datasets.parentResidues] as AnyRecord[][];
    expect(strip).toHaveLength(positions.filter((position) => position.catalyticRoles.length > 0).length);
    expect(measured).toHaveLength(cells.filter((cell) => cell.log10FoldChange !== null).length);
    expect(notCompared.every((cell) => cell.state === NOT_COMPARED_LABEL)).toBe(true);
    expect(measured.length + notCompared.length).toBe(9500);
    expect(parents).toHaveLength(500);
    expect(parents.every((dot) => dot.variantId === 7)).toBe(true);
    // A diverging scale centred on the parent: symmetric domain, mid at zero.
    const colour = (vega.scales ?? []).concat(...((vega.marks ?? []) as { scales?: never[] }[]).map((mark) => mark.scales ?? [])).find((scale) => JSON.stringify(scale).includes('domainMid'));
    expect(colour).toMatchObject({ domainMid: 0 });
    const domain = (colour as unknown as { domain: number[] }).domain;
    expect(domain[0]).toBe(-domain[1]);
  });
});

describe('landscape charts', () => {
  it('draws lines of equal kcat/Km at 45° and shades the diffusion-limited region from 10⁸ M⁻¹ s⁻¹', async () => {
    const points = [
      { variantId: 1, label: 'parent', kcatPerSecond: 11, kmMolar: 1e-3, isParent: true, mutationCount: 0 },
      { variantId: 2, label: 'Y87F', kcatPerSecond: 9.9, kmMolar: 1.1e-3, isParent: false, mutationCount: 1 },
      { variantId: 3, label: 'C112A', kcatPerSecond: 1.3e-3, kmMolar: 8e-4, isParent: false, mutationCount: 1 },
      { variantId: 4, label: 'Y87F/R215K', kcatPerSecond: 7.9, kmMolar: 3.4e-3, isParent: false, mutationCount: 2 },
    ];
    const spec = kcatKmScatterSpec({ title: 'kcat against Km', points });
    await expectCompleteChart(spec, ['Km (mM)', 'kcat (s⁻¹)']);
    const factor = kmDisplayUnit(points.map((point) => point.kmMolar)).factor;
    expect(factor).toBe(1e3);
    const [region, , isoLines] = layerValues(spec);
    // kcat/Km = kcat/(Km in M) is constant along each line and a power of ten.
    const byLine = new Map<string, number[]>();
    for (const point of isoLines) byLine.set(point.line as string, [...(byLine.get(point.line as string) ?? []), Math.log10((point.y as number) / ((point.x as number) / factor))]);
    expect(byLine.size).toBeGreaterThan(2);
    for (const exponents of byLine.values()) {
      expect(exponents).toHaveLength(2);
      expect(exponents[0]).toBeCloseTo(exponents[1], 9);
      expect(exponents[0]).toBeCloseTo(Math.round(exponents[0]), 9);
    }
    // The region's lower edge is kcat = 10⁸·Km (DIFFUSION_LIMIT_APPROACH_PER_MOLAR_SECOND; Alberty & Hammes 1958).
    expect(region.length).toBe(2);
    for (const corner of region) expect((corner.y as number) / ((corner.x as number) / factor)).toBeCloseTo(1e8, 0);
  });

  it('plots observed against predicted ΔΔG‡ and calls a cycle coupled beyond two standard errors', async () => {
    const spec = additivitySpec({
      title: 'Additivity',
      unit: 'kJ/mol',
      points: [
        { combinationId: 1, label: 'Y87E/W160F', predicted: -0.43, predictedSe: 0.21, observed: 2.31, observedSe: 0.1, coupling: 2.74, couplingSe: 0.19 },
        { combinationId: 2, label: 'E64D/Y87F', predicted: 5.65, predictedSe: 0.18, observed: 5.52, observedSe: 0.11, coupling: -0.13, couplingSe: 0.16 },
      ],
    });
    await expectCompleteChart(spec, ['Predicted ΔΔG‡, sum of the singles (kJ/mol)', 'Observed ΔΔG‡ of the combination (kJ/mol)']);
    const [line, rows] = layerValues(spec);
    // The axes reach half a unit past the widest error bar, in whole units: −0.64 − 0.5 → −2, 5.83 + 0.5 → 7.
    expect(line.map((point) => point.v)).toEqual([-2, 7]);
    expect(rows.map((row) => row.kind)).toEqual(['Coupled: |ΔΔG‡int| > 2 SE', 'Additive within 2 SE']);
  });

  it('measures pH-optimum shifts from the parent and marks the shift the target pH needs', async () => {
    const spec = phOptimumShiftSpec({
      title: 'pH-optimum shift',
      parentPhOptimum: 8.02,
      targetPh: 5.5,
      points: [
        { variantId: 1, label: 'Y87D', phOptimum: 7.57 },
        { variantId: 2, label: 'Y87L', phOptimum: 8.3 },
      ],
    });
    await expectCompleteChart(spec, ['Shift of the pH optimum from the parent (pH units)']);
    const [, target, rows] = layerValues(spec);
    expect(target[0].shift).toBeCloseTo(5.5 - 8.02, 10);
    expect(rows.map((row) => [row.label, Number((row.shift as number).toFixed(2)), row.direction])).toEqual([
      ['Y87D', -0.45, 'Optimum lower than the parent’s'],
      ['Y87L', 0.28, 'Optimum higher than the parent’s'],
    ]);
  });
});
