import type { TopLevelSpec } from 'vega-lite';
import type { BandPoint } from '@shared/kinetics/confidence-band';
import { chartColors } from '../chart-theme';
import { BAND_LABEL, type ChartWithData, type LayerList, EXCLUDED_LABEL, chartFrame, excludedSeries, seriesScales, withUnit } from './spec-parts';

/** One rate point as a chart draws it, in the units it was entered in. */
export interface RatePointDatum {
  /** Identifies the point to the page (for exclusion by click). */
  key: string;
  s: number;
  v: number;
  /** 1-based replicate series. */
  replicate: number;
  excluded: boolean;
  reason?: string | null;
}

export interface MichaelisMentenSpecInput {
  title: string;
  subtitle?: string;
  points: readonly RatePointDatum[];
  curve: readonly BandPoint[];
  hasBand: boolean;
  /** Legend name of the curve, e.g. `Michaelis–Menten fit`. */
  curveLabel: string;
  sUnit: string;
  vUnit: string;
  /** Points react to clicks (the entry page excludes them). */
  clickable: boolean;
}

/** `Replicate 2`, the legend name of a replicate series. */
export const replicateLabel = (replicate: number) => `Replicate ${replicate}`;

/**
 * Initial rate against substrate concentration: the points by replicate (excluded ones as ×), the fitted
 * curve and its 95 % confidence band.
 *
 * @param input the points, the curve and the units
 * @returns a Vega-Lite spec with datasets `band`, `curve` and `points`
 */
export function michaelisMentenSpec(input: MichaelisMentenSpecInput): ChartWithData {
  const replicates = [...new Set(input.points.filter((point) => !point.excluded).map((point) => point.replicate))].sort((a, b) => a - b);
  const fixed = [
    ...(input.points.some((point) => point.excluded) ? [excludedSeries] : []),
    { label: input.curveLabel, color: chartColors.fit, shape: 'stroke' },
    ...(input.hasBand ? [{ label: BAND_LABEL, color: chartColors.band, shape: 'square' }] : []),
  ];
  const scales = seriesScales(replicates.map(replicateLabel), fixed);
  const sTitle = withUnit('[S]', input.sUnit);
  const vTitle = withUnit('v₀', input.vUnit);
  const points = input.points.map((point) => ({
    ...point,
    series: point.excluded ? EXCLUDED_LABEL : replicateLabel(point.replicate),
    status: point.excluded ? `excluded${point.reason ? `: ${point.reason}` : ''}` : 'in the fit',
  }));
  const curve = input.curve.map((point) => ({ ...point, series: input.curveLabel }));
  const band = input.curve.map((point) => ({ ...point, series: BAND_LABEL }));
  // Solid legend symbols: the merged legend would otherwise take the band's transparency.
  const color = { field: 'series', type: 'nominal', title: null, scale: { domain: scales.domain, range: scales.colors }, legend: { symbolOpacity: 1 } } as const;

  // Layers without data are left out: Vega warns about the empty extent of their scales.
  const bandLayers: LayerList = input.hasBand && input.curve.length > 0
    ? [
        {
          data: { name: 'band' },
          mark: { type: 'area', opacity: 0.45 },
          encoding: {
            x: { field: 'x', type: 'quantitative', title: sTitle },
            y: { field: 'lower', type: 'quantitative', title: vTitle },
            y2: { field: 'upper' },
            color,
            tooltip: [
              { field: 'x', type: 'quantitative', title: sTitle, format: '.3~g' },
              { field: 'lower', type: 'quantitative', title: 'band, lower', format: '.3~g' },
              { field: 'upper', type: 'quantitative', title: 'band, upper', format: '.3~g' },
            ],
          },
        },
      ]
    : [];
  const curveLayers: LayerList = input.curve.length > 0
    ? [
        {
          data: { name: 'curve' },
          mark: { type: 'line', strokeWidth: 2 },
          encoding: {
            x: { field: 'x', type: 'quantitative', title: sTitle },
            y: { field: 'y', type: 'quantitative', title: vTitle },
            color,
          },
        },
      ]
    : [];
  const spec: TopLevelSpec = {
    ...chartFrame(input.title, input.subtitle, `Initial rate against substrate concentration with the ${input.curveLabel}.`),
    width: 'container',
    height: 300,
    layer: [
      ...bandLayers,
      ...curveLayers,
      {
        data: { name: 'points' },
        mark: { type: 'point', filled: true, size: 70, opacity: 1, cursor: input.clickable ? 'pointer' : 'default' },
        encoding: {
          x: { field: 's', type: 'quantitative', title: sTitle },
          y: { field: 'v', type: 'quantitative', title: vTitle },
          color,
          shape: { field: 'series', type: 'nominal', title: null, scale: { domain: scales.domain, range: scales.shapes } },
          tooltip: [
            { field: 's', type: 'quantitative', title: sTitle, format: '.4~g' },
            { field: 'v', type: 'quantitative', title: vTitle, format: '.4~g' },
            { field: 'replicate', type: 'ordinal', title: 'Replicate' },
            { field: 'status', type: 'nominal', title: 'Status' },
          ],
        },
      },
    ],
  };
  // Only the datasets the spec names: a drawn view refuses rows for a dataset it does not have.
  return { spec, datasets: { points, ...(bandLayers.length > 0 ? { band } : {}), ...(curveLayers.length > 0 ? { curve } : {}) } };
}
