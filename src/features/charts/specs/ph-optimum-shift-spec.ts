import type { TopLevelSpec } from 'vega-lite';
import { chartColors } from '../chart-theme';
import { chartFrame } from './spec-parts';

/** One variant's pH optimum. */
export interface PhOptimumPoint {
  variantId: number;
  label: string;
  phOptimum: number;
}

export interface PhOptimumShiftSpecInput {
  title: string;
  subtitle?: string;
  parentPhOptimum: number;
  /** The campaign's target pH, marked as the shift it would take to get there. */
  targetPh: number | null;
  points: readonly PhOptimumPoint[];
}

const TOWARDS_ACID = 'Optimum lower than the parent’s';
const TOWARDS_BASE = 'Optimum higher than the parent’s';
const NO_SHIFT = 'Same as the parent';

/**
 * How far each variant's pH optimum lies from the parent's, in pH units, as a lollipop per variant sorted
 * by shift, with the shift the campaign's target pH would need drawn as a reference line. Direction is
 * shown by colour and by the marker's shape (◀ lower, ▶ higher).
 *
 * @param input the parent's optimum, the target pH and the variants' optima
 * @returns a Vega-Lite spec
 */
export function phOptimumShiftSpec(input: PhOptimumShiftSpecInput): TopLevelSpec {
  const rows = input.points
    .map((point) => {
      const shift = point.phOptimum - input.parentPhOptimum;
      const direction = Math.abs(shift) < 0.005 ? NO_SHIFT : shift < 0 ? TOWARDS_ACID : TOWARDS_BASE;
      return { ...point, shift, zero: 0, direction };
    })
    .sort((first, second) => first.shift - second.shift);
  const directions = [TOWARDS_ACID, NO_SHIFT, TOWARDS_BASE];
  const y = { field: 'label', type: 'nominal', title: null, sort: rows.map((row) => row.label) } as const;
  const color = { field: 'direction', type: 'nominal', title: null, scale: { domain: directions, range: [chartColors.highlight, chartColors.reference, chartColors.variant] } } as const;
  const target = input.targetPh === null ? [] : [{ shift: input.targetPh - input.parentPhOptimum, text: `campaign target pH ${input.targetPh.toFixed(1)}` }];
  return {
    ...chartFrame(input.title, input.subtitle, `Shift of the pH optimum from the parent's (pH ${input.parentPhOptimum.toFixed(2)}) for ${rows.length} variants.`),
    width: 'container',
    height: { step: 20 },
    layer: [
      {
        data: { values: [{ zero: 0 }] },
        mark: { type: 'rule', color: chartColors.zeroLine },
        encoding: { x: { field: 'zero', type: 'quantitative' } },
      },
      {
        data: { values: target },
        layer: [
          { mark: { type: 'rule', color: chartColors.optimum, strokeDash: [5, 3] }, encoding: { x: { field: 'shift', type: 'quantitative' } } },
          {
            mark: { type: 'text', align: 'left', baseline: 'top', dx: 4, y: 2, color: chartColors.optimum, fontSize: 11 },
            encoding: { x: { field: 'shift', type: 'quantitative' }, text: { field: 'text' } },
          },
        ],
      },
      {
        data: { values: rows },
        layer: [
          {
            mark: { type: 'rule', strokeWidth: 2 },
            encoding: { y, x: { field: 'zero', type: 'quantitative' }, x2: { field: 'shift' }, color },
          },
          {
            mark: { type: 'point', filled: true, size: 80, opacity: 1, cursor: 'pointer' },
            encoding: {
              y,
              x: { field: 'shift', type: 'quantitative', title: 'Shift of the pH optimum from the parent (pH units)' },
              color,
              shape: { field: 'direction', type: 'nominal', title: null, scale: { domain: directions, range: ['triangle-left', 'circle', 'triangle-right'] } },
              tooltip: [
                { field: 'label', type: 'nominal', title: 'Variant' },
                { field: 'phOptimum', type: 'quantitative', title: 'pH optimum', format: '.2f' },
                { field: 'shift', type: 'quantitative', title: 'Shift (pH units)', format: '+.2f' },
              ],
            },
          },
        ],
      },
    ],
  };
}
