import type { TopLevelSpec } from 'vega-lite';
import { chartColors } from '../chart-theme';
import { chartFrame } from './spec-parts';

/** One double-mutant cycle in the display unit of energy. */
export interface AdditivityPoint {
  combinationId: number;
  label: string;
  /** ΔΔG‡(A) + ΔΔG‡(B): what the combination would show if the two acted independently. */
  predicted: number;
  predictedSe: number;
  /** ΔΔG‡ of the combination. */
  observed: number;
  observedSe: number;
  /** ΔΔG‡int = observed − predicted. */
  coupling: number;
  couplingSe: number;
}

export interface AdditivitySpecInput {
  title: string;
  subtitle?: string;
  /** `kJ/mol` or `kcal/mol`. */
  unit: string;
  points: readonly AdditivityPoint[];
}

/** How many standard errors a coupling energy must exceed to be called coupled. */
export const COUPLING_SE_MULTIPLE = 2;
const ADDITIVE = `Additive within ${COUPLING_SE_MULTIPLE} SE`;
const COUPLED = `Coupled: |ΔΔG‡int| > ${COUPLING_SE_MULTIPLE} SE`;
/** Show names beside the points up to this many combinations. */
const MAX_LABELLED_POINTS = 25;

/**
 * Additivity of combinations: observed ΔΔG‡ of each combination against the sum of its singles' ΔΔG‡,
 * with error bars of ± one SE on both axes and the y = x line on which independent (additive) mutations
 * lie. Distance from the line is the coupling energy ΔΔG‡int of the double-mutant cycle (Carter et al.,
 * Cell 38 (1984) 835; Horovitz, Fold. Des. 1 (1996) R121).
 *
 * @param input the cycles' energies in the display unit
 * @returns a Vega-Lite spec
 */
export function additivitySpec(input: AdditivitySpecInput): TopLevelSpec {
  const rows = input.points.map((point) => ({
    ...point,
    kind: Math.abs(point.coupling) > COUPLING_SE_MULTIPLE * point.couplingSe ? COUPLED : ADDITIVE,
    predictedLow: point.predicted - point.predictedSe,
    predictedHigh: point.predicted + point.predictedSe,
    observedLow: point.observed - point.observedSe,
    observedHigh: point.observed + point.observedSe,
  }));
  const values = rows.flatMap((row) => [row.predictedLow, row.predictedHigh, row.observedLow, row.observedHigh]);
  const low = Math.floor(Math.min(0, ...values) - 0.5);
  const high = Math.ceil(Math.max(0, ...values) + 0.5);
  const domain = [low, high];
  const xTitle = `Predicted ΔΔG‡, sum of the singles (${input.unit})`;
  const yTitle = `Observed ΔΔG‡ of the combination (${input.unit})`;
  const x = { type: 'quantitative', title: xTitle, scale: { domain } } as const;
  const y = { type: 'quantitative', title: yTitle, scale: { domain } } as const;
  const kinds = [ADDITIVE, COUPLED];
  const color = { field: 'kind', type: 'nominal', title: null, scale: { domain: kinds, range: [chartColors.variant, chartColors.highlight] } } as const;
  return {
    ...chartFrame(input.title, input.subtitle, `Observed against predicted ΔΔG‡ for ${rows.length} combinations, with the line of perfect additivity.`),
    width: 'container',
    height: 360,
    layer: [
      {
        data: { values: [{ v: low, label: '' }, { v: high, label: 'y = x (additive)' }] },
        layer: [
          { mark: { type: 'line', color: chartColors.reference, strokeDash: [5, 4] }, encoding: { x: { field: 'v', ...x }, y: { field: 'v', ...y } } },
          {
            mark: { type: 'text', align: 'right', baseline: 'top', dx: -4, dy: 6, color: chartColors.reference, fontSize: 11 },
            encoding: { x: { field: 'v', ...x }, y: { field: 'v', ...y }, text: { field: 'label' } },
          },
        ],
      },
      {
        data: { values: rows },
        layer: [
          { mark: { type: 'rule' }, encoding: { x: { field: 'predictedLow', ...x }, x2: { field: 'predictedHigh' }, y: { field: 'observed', ...y }, color } },
          { mark: { type: 'rule' }, encoding: { y: { field: 'observedLow', ...y }, y2: { field: 'observedHigh' }, x: { field: 'predicted', ...x }, color } },
          {
            mark: { type: 'point', filled: true, size: 80, opacity: 1, cursor: 'pointer' },
            encoding: {
              x: { field: 'predicted', ...x },
              y: { field: 'observed', ...y },
              color,
              shape: { field: 'kind', type: 'nominal', title: null, scale: { domain: kinds, range: ['circle', 'diamond'] } },
              tooltip: [
                { field: 'label', type: 'nominal', title: 'Combination' },
                { field: 'predicted', type: 'quantitative', title: xTitle, format: '.2f' },
                { field: 'observed', type: 'quantitative', title: yTitle, format: '.2f' },
                { field: 'coupling', type: 'quantitative', title: `ΔΔG‡int (${input.unit})`, format: '+.2f' },
                { field: 'couplingSe', type: 'quantitative', title: `SE of ΔΔG‡int (${input.unit})`, format: '.2f' },
              ],
            },
          },
          ...(rows.length <= MAX_LABELLED_POINTS
            ? [
                {
                  mark: { type: 'text' as const, align: 'left' as const, dx: 7, dy: -7, fontSize: 10, color: chartColors.text },
                  encoding: { x: { field: 'predicted', ...x }, y: { field: 'observed', ...y }, text: { field: 'label' } },
                },
              ]
            : []),
        ],
      },
    ],
  };
}
