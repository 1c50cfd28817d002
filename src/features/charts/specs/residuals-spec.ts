import type { TopLevelSpec } from 'vega-lite';
import { chartColors } from '../chart-theme';
import { replicateLabel, type RatePointDatum } from './michaelis-menten-spec';
import { EXCLUDED_LABEL, chartFrame, type ChartWithData, excludedSeries, seriesScales, withUnit } from './spec-parts';

export interface ResidualsSpecInput {
  title: string;
  subtitle?: string;
  /** Each point with its residual, observed − fitted, in the unit of v. */
  points: readonly (RatePointDatum & { residual: number })[];
  sUnit: string;
  vUnit: string;
  clickable: boolean;
}

/**
 * Residuals (observed − fitted initial rate) against substrate concentration, by replicate, around a zero
 * line: a trend in them says the model does not describe the data. Excluded points show their distance
 * from the curve they did not enter.
 *
 * @param input the points with residuals and the units
 * @returns a Vega-Lite spec with the dataset `points`
 */
export function residualsSpec(input: ResidualsSpecInput): ChartWithData {
  const replicates = [...new Set(input.points.filter((point) => !point.excluded).map((point) => point.replicate))].sort((a, b) => a - b);
  const scales = seriesScales(replicates.map(replicateLabel), input.points.some((point) => point.excluded) ? [excludedSeries] : []);
  const sTitle = withUnit('[S]', input.sUnit);
  const residualTitle = withUnit('Residual, v₀ − fit', input.vUnit);
  const points = input.points.map((point) => ({
    ...point,
    series: point.excluded ? EXCLUDED_LABEL : replicateLabel(point.replicate),
  }));
  const spec: TopLevelSpec = {
    ...chartFrame(input.title, input.subtitle, 'Residuals of the fit against substrate concentration.'),
    width: 'container',
    height: 180,
    layer: [
      {
        data: { values: [{ zero: 0 }] },
        mark: { type: 'rule', color: chartColors.zeroLine, strokeDash: [4, 3] },
        encoding: { y: { field: 'zero', type: 'quantitative' } },
      },
      {
        data: { name: 'points' },
        mark: { type: 'point', filled: true, size: 60, opacity: 1, cursor: input.clickable ? 'pointer' : 'default' },
        encoding: {
          x: { field: 's', type: 'quantitative', title: sTitle },
          y: { field: 'residual', type: 'quantitative', title: residualTitle },
          color: { field: 'series', type: 'nominal', title: null, scale: { domain: scales.domain, range: scales.colors } },
          shape: { field: 'series', type: 'nominal', title: null, scale: { domain: scales.domain, range: scales.shapes } },
          tooltip: [
            { field: 's', type: 'quantitative', title: sTitle, format: '.4~g' },
            { field: 'residual', type: 'quantitative', title: residualTitle, format: '.3~g' },
            { field: 'replicate', type: 'ordinal', title: 'Replicate' },
          ],
        },
      },
    ],
  };
  return { spec, datasets: { points } };
}
