import type { TopLevelSpec } from 'vega-lite';
import { chartColors, seriesStyle } from '../chart-theme';

/** Vega-Lite's schema; every spec names it so exported sources are self-describing. */
export const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/**
 * The × mark of excluded points: a filled outline (SVG path in Vega's unit square), because the points are
 * drawn filled and a stroked × would not show.
 */
export const EXCLUDED_SHAPE = 'M-1,-0.6L-0.6,-1L0,-0.4L0.6,-1L1,-0.6L0.4,0L1,0.6L0.6,1L0,0.4L-0.6,1L-1,0.6L-0.4,0Z';

/** Series name of excluded points. */
export const EXCLUDED_LABEL = 'Excluded';
/** Series name of the confidence band. */
export const BAND_LABEL = '95 % confidence band';

/**
 * A chart whose data change more often than its shape (the live fit): the spec names its datasets and
 * `datasets` holds their rows, so new data reach the drawn view without compiling the chart again.
 */
export interface ChartWithData {
  spec: TopLevelSpec;
  datasets: Record<string, readonly object[]>;
}

/** The layers of a layered chart, for building some of them only when they have data. */
export type LayerList = Extract<TopLevelSpec, { layer: unknown }>['layer'];

/** The parts every chart starts with: schema, title and subtitle, description, the container width. */
export function chartFrame(title: string, subtitle: string | undefined, description: string): Pick<TopLevelSpec, '$schema' | 'title' | 'description'> {
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: subtitle ? { text: title, subtitle } : { text: title },
    description,
  };
}

/**
 * A colour and a shape scale over the same series names, so one merged legend names every series and
 * each keeps a distinct shape. Replicates take the series styles in order; the fixed series (fit, band,
 * excluded…) take the colours given.
 */
export function seriesScales(
  replicateLabels: readonly string[],
  fixed: readonly { label: string; color: string; shape: string }[],
): { domain: string[]; colors: string[]; shapes: string[] } {
  const replicates = replicateLabels.map((label, index) => ({ label, ...seriesStyle(index) }));
  const all = [...replicates, ...fixed];
  return { domain: all.map((item) => item.label), colors: all.map((item) => item.color), shapes: all.map((item) => item.shape) };
}

/** The excluded-point series style. */
export const excludedSeries = { label: EXCLUDED_LABEL, color: chartColors.excluded, shape: EXCLUDED_SHAPE };

/** `[S] (mM)`: a quantity with its unit, as axis titles and tooltips write it. */
export function withUnit(quantity: string, unit: string): string {
  return unit ? `${quantity} (${unit})` : quantity;
}

/** `1 variant`, `2 variants`: a count with its noun. */
export function counted(count: number, noun: string): string {
  return `${count.toLocaleString('en-US')} ${noun}${count === 1 ? '' : 's'}`;
}

/** `n` evenly spaced values from `low` to `high`, both included. */
export function linearGrid(low: number, high: number, n: number): number[] {
  if (n < 2 || high <= low) return [low];
  return Array.from({ length: n }, (_, index) => low + ((high - low) * index) / (n - 1));
}
