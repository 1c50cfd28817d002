import type { TopLevelSpec } from 'vega-lite';
import { powerOfTen } from '@/lib/format';
import { DIFFUSION_LIMIT_APPROACH_PER_MOLAR_SECOND } from '@shared/kinetics/plausibility';
import { chartColors, seriesStyle } from '../chart-theme';
import { chartFrame } from './spec-parts';

/** One variant's summary kinetics, SI units. */
export interface KineticsPoint {
  variantId: number;
  label: string;
  kcatPerSecond: number;
  kmMolar: number;
  isParent: boolean;
  mutationCount: number;
}

export interface KcatKmScatterSpecInput {
  title: string;
  subtitle?: string;
  points: readonly KineticsPoint[];
}

const KM_UNITS = [
  { unit: 'mM', factor: 1e3, from: 1e-3 },
  { unit: 'µM', factor: 1e6, from: 1e-6 },
  { unit: 'nM', factor: 1e9, from: 0 },
] as const;

/** How far the axes may stretch in all to show the diffusion-limited corner, decades. */
const MAX_EXTENSION_DECADES = 6;
/** More lines of equal kcat/Km than this, and only every other decade is drawn. */
const MAX_ISO_LINES = 6;

/** The Km unit that suits the median Km. */
export function kmDisplayUnit(kmMolar: readonly number[]): (typeof KM_UNITS)[number] {
  const sorted = [...kmMolar].sort((a, b) => a - b);
  const median = sorted.length === 0 ? 1e-3 : sorted[Math.floor(sorted.length / 2)];
  return KM_UNITS.find((entry) => median >= entry.from)!;
}

function category(point: KineticsPoint): string {
  if (point.isParent) return 'Parent';
  if (point.mutationCount === 1) return 'Single substitution';
  if (point.mutationCount === 2) return 'Double';
  return 'Triple or more';
}
const CATEGORIES = ['Parent', 'Single substitution', 'Double', 'Triple or more'];

/**
 * kcat against Km on log–log axes, one point per variant. Lines of equal kcat/Km run at 45° there
 * (kcat = (kcat/Km)·Km), one per decade; the region at and above 10⁸ M⁻¹ s⁻¹, where kcat/Km approaches the
 * diffusion limit (Alberty & Hammes 1958, via shared/kinetics/plausibility), is shaded. The axes are
 * stretched by up to six decades in all so that corner is in view.
 *
 * @param input the variants' kcat and Km (SI)
 * @returns a Vega-Lite spec
 */
export function kcatKmScatterSpec(input: KcatKmScatterSpecInput): TopLevelSpec {
  const points = input.points.filter((point) => point.kcatPerSecond > 0 && point.kmMolar > 0);
  const kmUnit = kmDisplayUnit(points.map((point) => point.kmMolar));
  const log = Math.log10;
  let kcatLow = Number.POSITIVE_INFINITY;
  let kcatHigh = Number.NEGATIVE_INFINITY;
  let kmLow = Number.POSITIVE_INFINITY;
  let kmHigh = Number.NEGATIVE_INFINITY;
  let specificityLow = Number.POSITIVE_INFINITY;
  let specificityHigh = Number.NEGATIVE_INFINITY;
  for (const point of points) {
    kcatLow = Math.min(kcatLow, point.kcatPerSecond);
    kcatHigh = Math.max(kcatHigh, point.kcatPerSecond);
    kmLow = Math.min(kmLow, point.kmMolar);
    kmHigh = Math.max(kmHigh, point.kmMolar);
    specificityLow = Math.min(specificityLow, point.kcatPerSecond / point.kmMolar);
    specificityHigh = Math.max(specificityHigh, point.kcatPerSecond / point.kmMolar);
  }
  // Axes in whole decades around the data (log10 of s⁻¹ and of M).
  const yLow = Math.floor(log(kcatLow));
  let yHigh = Math.max(Math.ceil(log(kcatHigh)), yLow + 1);
  let xLow = Math.floor(log(kmLow));
  const xHigh = Math.max(Math.ceil(log(kmHigh)), xLow + 1);
  // The diffusion line kcat = 10⁸·Km crosses the top edge at Km = kcat_max/10⁸. Bring that corner into
  // view by stretching both axes about equally (kcat up, Km down), by at most a few decades in all.
  const diffusionExponent = log(DIFFUSION_LIMIT_APPROACH_PER_MOLAR_SECOND);
  const missing = Math.min(MAX_EXTENSION_DECADES, Math.max(0, Math.ceil(xLow - (yHigh - diffusionExponent) + 0.5)));
  yHigh += Math.floor(missing / 2);
  xLow -= Math.ceil(missing / 2);

  const xDomain = [10 ** xLow * kmUnit.factor, 10 ** xHigh * kmUnit.factor];
  const yDomain = [10 ** yLow, 10 ** yHigh];
  // Lines of equal kcat/Km through the data's range, one decade apart (two when there are many), each
  // clipped to the plot: log kcat = e + log Km.
  const fromExponent = Math.floor(log(specificityLow));
  const toExponent = Math.ceil(log(specificityHigh));
  const stride = toExponent - fromExponent > MAX_ISO_LINES ? 2 : 1;
  const isoLines: { line: string; x: number; y: number; label: string; end: boolean }[] = [];
  for (let exponent = fromExponent; exponent <= toExponent; exponent += stride) {
    const fromLogKm = Math.max(xLow, yLow - exponent);
    const toLogKm = Math.min(xHigh, yHigh - exponent);
    if (toLogKm - fromLogKm < 0.3) continue;
    const label = `${powerOfTen(exponent)} M⁻¹ s⁻¹`;
    isoLines.push({ line: label, x: 10 ** fromLogKm * kmUnit.factor, y: 10 ** (fromLogKm + exponent), label, end: false });
    isoLines.push({ line: label, x: 10 ** toLogKm * kmUnit.factor, y: 10 ** (toLogKm + exponent), label, end: true });
  }
  const regionFrom = Math.max(xLow, yLow - diffusionExponent);
  const regionTo = Math.min(xHigh, yHigh - diffusionExponent);
  const diffusionRegion =
    regionTo > regionFrom
      ? [
          { x: 10 ** regionFrom * kmUnit.factor, y: 10 ** (regionFrom + diffusionExponent), top: yDomain[1] },
          { x: 10 ** regionTo * kmUnit.factor, y: 10 ** (regionTo + diffusionExponent), top: yDomain[1] },
        ]
      : [];
  const decades = (low: number, high: number, factor: number) => Array.from({ length: high - low + 1 }, (_, index) => 10 ** (low + index) * factor);

  const kmTitle = `Km (${kmUnit.unit})`;
  const kcatTitle = 'kcat (s⁻¹)';
  const xScale = { type: 'log', domain: xDomain } as const;
  const yScale = { type: 'log', domain: yDomain } as const;
  // Ticks and grid lines at whole decades only: the minor ticks of a log axis crowd out the labels.
  const xAxis = { values: decades(xLow, xHigh, kmUnit.factor), format: '~g' } as const;
  const yAxis = { values: decades(yLow, yHigh, 1), format: '~g' } as const;
  const data = points.map((point) => ({
    ...point,
    km: point.kmMolar * kmUnit.factor,
    kcatOverKm: point.kcatPerSecond / point.kmMolar,
    category: category(point),
  }));
  const present = CATEGORIES.filter((name) => data.some((point) => point.category === name));
  const styles = present.map((name) => (name === 'Parent' ? { color: chartColors.parent, shape: 'diamond' } : seriesStyle(CATEGORIES.indexOf(name) - 1)));

  return {
    ...chartFrame(input.title, input.subtitle, `kcat against Km on log axes for ${data.length} variants, with lines of equal kcat/Km and the diffusion-limited region shaded.`),
    width: 'container',
    height: 360,
    layer: [
      {
        data: { values: diffusionRegion },
        mark: { type: 'area', color: chartColors.diffusionRegion, clip: true },
        encoding: {
          x: { field: 'x', type: 'quantitative', title: kmTitle, scale: xScale, axis: xAxis },
          y: { field: 'y', type: 'quantitative', title: kcatTitle, scale: yScale, axis: yAxis },
          y2: { field: 'top' },
        },
      },
      {
        data: { values: diffusionRegion.slice(0, 1) },
        mark: { type: 'text', align: 'left', baseline: 'top', dx: 6, dy: 6, color: chartColors.diffusionText, fontSize: 11, clip: true },
        encoding: {
          x: { field: 'x', type: 'quantitative', scale: xScale },
          y: { field: 'top', type: 'quantitative', scale: yScale },
          text: { value: 'near the diffusion limit (kcat/Km ≥ 10⁸ M⁻¹ s⁻¹)' },
        },
      },
      {
        data: { values: isoLines },
        mark: { type: 'line', color: chartColors.isoLine, strokeDash: [4, 4], clip: true },
        encoding: {
          x: { field: 'x', type: 'quantitative', scale: xScale },
          y: { field: 'y', type: 'quantitative', scale: yScale },
          detail: { field: 'line', type: 'nominal' },
        },
      },
      {
        data: { values: isoLines.filter((line) => line.end) },
        mark: { type: 'text', align: 'right', baseline: 'bottom', dx: -2, dy: -2, color: chartColors.isoText, fontSize: 10, angle: 0 },
        encoding: {
          x: { field: 'x', type: 'quantitative', scale: xScale },
          y: { field: 'y', type: 'quantitative', scale: yScale },
          text: { field: 'label' },
        },
      },
      {
        data: { values: data },
        mark: { type: 'point', filled: true, size: 60, opacity: 0.9, cursor: 'pointer' },
        encoding: {
          x: { field: 'km', type: 'quantitative', title: kmTitle, scale: xScale, axis: xAxis },
          y: { field: 'kcatPerSecond', type: 'quantitative', title: kcatTitle, scale: yScale, axis: yAxis },
          color: { field: 'category', type: 'nominal', title: 'Variant', scale: { domain: present, range: styles.map((style) => style.color) } },
          shape: { field: 'category', type: 'nominal', title: 'Variant', scale: { domain: present, range: styles.map((style) => style.shape) } },
          tooltip: [
            { field: 'label', type: 'nominal', title: 'Variant' },
            { field: 'kcatPerSecond', type: 'quantitative', title: kcatTitle, format: '.3~g' },
            { field: 'km', type: 'quantitative', title: kmTitle, format: '.3~g' },
            { field: 'kcatOverKm', type: 'quantitative', title: 'kcat/Km (M⁻¹ s⁻¹)', format: '.3~e' },
          ],
        },
      },
    ],
  };
}
