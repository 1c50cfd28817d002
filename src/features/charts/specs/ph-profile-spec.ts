import type { TopLevelSpec } from 'vega-lite';
import type { BandPoint } from '@shared/kinetics/confidence-band';
import { chartColors, seriesStyle } from '../chart-theme';
import { BAND_LABEL, type ChartWithData, type LayerList, EXCLUDED_LABEL, chartFrame, excludedSeries, seriesScales } from './spec-parts';

/** One point of a pH profile. */
export interface PhPointDatum {
  key: string;
  ph: number;
  k: number;
  excluded: boolean;
}

/** A fitted pH value drawn as a marker: a pKa or the optimum. */
export interface PhMarker {
  label: string;
  value: number;
  se: number | null;
}

export interface PhProfileSpecInput {
  title: string;
  subtitle?: string;
  points: readonly PhPointDatum[];
  curve: readonly BandPoint[];
  hasBand: boolean;
  curveLabel: string;
  /** Axis title of the rate with its unit, e.g. `kcat (s⁻¹)`. */
  rateTitle: string;
  pkas: readonly PhMarker[];
  optimum: PhMarker | null;
  clickable: boolean;
}

const MEASURED_LABEL = 'Measured';
const PKA_LABEL = 'Fitted pKa';
const OPTIMUM_LABEL = 'pH optimum';

function markerText(marker: PhMarker): string {
  return `${marker.label} ${marker.value.toFixed(2)}${marker.se !== null ? ` ± ${marker.se.toFixed(2)}` : ''}`;
}

/**
 * A pH–rate profile: the measured rates, the fitted curve with its 95 % band, a dashed line at each fitted
 * pKa and a solid one at the pH optimum, each labelled with its value and standard error.
 *
 * @param input points, curve, markers and the rate's axis title
 * @returns a Vega-Lite spec with datasets `band`, `curve`, `markers` and `points`
 */
export function phProfileSpec(input: PhProfileSpecInput): ChartWithData {
  const hasExcluded = input.points.some((point) => point.excluded);
  const scales = seriesScales([], [
    { label: MEASURED_LABEL, ...seriesStyle(0) },
    ...(hasExcluded ? [excludedSeries] : []),
    { label: input.curveLabel, color: chartColors.fit, shape: 'stroke' },
    ...(input.hasBand ? [{ label: BAND_LABEL, color: chartColors.band, shape: 'square' }] : []),
    ...(input.pkas.length > 0 ? [{ label: PKA_LABEL, color: chartColors.reference, shape: 'stroke' }] : []),
    ...(input.optimum ? [{ label: OPTIMUM_LABEL, color: chartColors.optimum, shape: 'stroke' }] : []),
  ]);
  const color = { field: 'series', type: 'nominal', title: null, scale: { domain: scales.domain, range: scales.colors }, legend: { symbolOpacity: 1 } } as const;
  const points = input.points.map((point) => ({ ...point, series: point.excluded ? EXCLUDED_LABEL : MEASURED_LABEL }));
  const markers = [
    ...input.pkas.map((marker) => ({ ...marker, series: PKA_LABEL, text: markerText(marker) })),
    ...(input.optimum ? [{ ...input.optimum, series: OPTIMUM_LABEL, text: markerText(input.optimum) }] : []),
  ];
  const band = input.curve.map((point) => ({ ...point, series: BAND_LABEL }));
  const curve = input.curve.map((point) => ({ ...point, series: input.curveLabel }));
  const phTitle = 'pH';
  // Layers without data are left out: Vega warns about the empty extent of their scales.
  const bandLayers: LayerList = input.hasBand && input.curve.length > 0
    ? [
        {
          data: { name: 'band' },
          mark: { type: 'area', opacity: 0.45 },
          encoding: {
            x: { field: 'x', type: 'quantitative', title: phTitle, scale: { zero: false } },
            y: { field: 'lower', type: 'quantitative', title: input.rateTitle },
            y2: { field: 'upper' },
            color,
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
            x: { field: 'x', type: 'quantitative', title: phTitle, scale: { zero: false } },
            y: { field: 'y', type: 'quantitative', title: input.rateTitle },
            color,
          },
        },
      ]
    : [];
  const markerLayers: LayerList = markers.length > 0
    ? [
        {
          data: { name: 'markers' },
          layer: [
            {
              mark: { type: 'rule', strokeWidth: 1.5 },
              encoding: {
                x: { field: 'value', type: 'quantitative', title: phTitle },
                color,
                strokeDash: { condition: { test: `datum.series === '${PKA_LABEL}'`, value: [5, 3] }, value: [1, 0] },
                tooltip: [{ field: 'text', type: 'nominal', title: 'Fitted' }],
              },
            },
            {
              mark: { type: 'text', angle: 270, align: 'right', baseline: 'bottom', dx: -4, dy: -3, fontSize: 11 },
              encoding: {
                x: { field: 'value', type: 'quantitative', title: phTitle },
                y: { value: 0 },
                text: { field: 'text' },
                color,
              },
            },
          ],
        },
      ]
    : [];
  const spec: TopLevelSpec = {
    ...chartFrame(input.title, input.subtitle, `${input.rateTitle} against pH with the fitted curve, its pKa values and the pH optimum.`),
    width: 'container',
    height: 300,
    layer: [
      ...bandLayers,
      ...curveLayers,
      ...markerLayers,
      {
        data: { name: 'points' },
        mark: { type: 'point', filled: true, size: 70, opacity: 1, cursor: input.clickable ? 'pointer' : 'default' },
        encoding: {
          x: { field: 'ph', type: 'quantitative', title: phTitle, scale: { zero: false } },
          y: { field: 'k', type: 'quantitative', title: input.rateTitle },
          color,
          shape: { field: 'series', type: 'nominal', title: null, scale: { domain: scales.domain, range: scales.shapes } },
          tooltip: [
            { field: 'ph', type: 'quantitative', title: 'pH', format: '.2f' },
            { field: 'k', type: 'quantitative', title: input.rateTitle, format: '.4~g' },
            { field: 'series', type: 'nominal', title: 'Status' },
          ],
        },
      },
    ],
  };
  // Only the datasets the spec names: a drawn view refuses rows for a dataset it does not have.
  return {
    spec,
    datasets: { points, ...(bandLayers.length > 0 ? { band } : {}), ...(curveLayers.length > 0 ? { curve } : {}), ...(markerLayers.length > 0 ? { markers } : {}) },
  };
}
