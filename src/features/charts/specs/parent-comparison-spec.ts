import type { TopLevelSpec } from 'vega-lite';
import type { NonNormalizedSpec } from 'vega-lite/types_unstable/spec/index.js';
import { chartColors } from '../chart-theme';
import { VEGA_LITE_SCHEMA } from './spec-parts';

/** A combined value with its standard error, in the unit of its parameter. */
export interface ValueWithError {
  value: number;
  se: number;
  /** How many measurements went into it. */
  n: number;
}

/** One kinetic parameter of the variant and of its parent. */
export interface ComparedParameter {
  /** `kcat`, `Km`, `kcat/Km`. */
  name: string;
  /** Display unit, e.g. `s⁻¹`, `mM`, `M⁻¹ s⁻¹`. */
  unit: string;
  /** Multiplies the SI value into the display unit. */
  factor: number;
  variant: ValueWithError | null;
  parent: ValueWithError | null;
}

export interface ParentComparisonSpecInput {
  title: string;
  subtitle?: string;
  variantLabel: string;
  parentLabel: string;
  parameters: readonly ComparedParameter[];
}

/**
 * The variant against its condition-matched parent: one panel per parameter (kcat, Km, kcat/Km) stacked, each a
 * log axis with the two values and error bars of ± one standard error. A log axis because fold changes
 * are what matter, and they read as equal distances there.
 *
 * @param input the labels and the parameters (SI values with their display factor)
 * @returns a Vega-Lite spec
 */
export function parentComparisonSpec(input: ParentComparisonSpecInput): TopLevelSpec {
  const who = [input.variantLabel, input.parentLabel];
  const color = { field: 'who', type: 'nominal', title: null, scale: { domain: who, range: [chartColors.variant, chartColors.parent] } } as const;
  const shape = { field: 'who', type: 'nominal', title: null, scale: { domain: who, range: ['circle', 'square'] } } as const;
  // Few ticks on a log axis: its minor ticks crowd the labels of a short panel.
  const axis = { tickCount: 4, format: '~g' } as const;
  const panels = input.parameters.map((parameter): NonNormalizedSpec => {
    const title = `${parameter.name} (${parameter.unit})`;
    const rows = (
      [
        [input.variantLabel, parameter.variant],
        [input.parentLabel, parameter.parent],
      ] as const
    )
      .filter((entry): entry is readonly [string, ValueWithError] => entry[1] !== null && entry[1].value > 0)
      .map(([label, measured]) => {
        const value = measured.value * parameter.factor;
        const se = measured.se * parameter.factor;
        // A log axis cannot reach zero: an error bar wider than the value stops a hundredth below it.
        return { who: label, value, se, low: Math.max(value - se, value / 100), high: value + se, n: measured.n };
      });
    return {
      width: 340,
      height: 56,
      title: { text: parameter.name, fontSize: 13 },
      data: { values: rows },
      layer: [
        {
          mark: { type: 'rule' as const, strokeWidth: 2 },
          encoding: {
            y: { field: 'who', type: 'nominal', title: null, sort: who },
            x: { field: 'low', type: 'quantitative', title, scale: { type: 'log' }, axis },
            x2: { field: 'high' },
            color,
          },
        },
        {
          mark: { type: 'point' as const, filled: true, size: 90, opacity: 1 },
          encoding: {
            y: { field: 'who', type: 'nominal', title: null, sort: who },
            x: { field: 'value', type: 'quantitative', title, scale: { type: 'log' }, axis },
            color,
            shape,
            tooltip: [
              { field: 'who', type: 'nominal', title: 'Variant' },
              { field: 'value', type: 'quantitative', title, format: '.3~g' },
              { field: 'se', type: 'quantitative', title: 'SE', format: '.2~g' },
              { field: 'n', type: 'quantitative', title: 'Measurements' },
            ],
          },
        },
      ],
    };
  });
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: input.subtitle ? { text: input.title, subtitle: input.subtitle } : { text: input.title },
    description: `${input.variantLabel} against ${input.parentLabel}: ${input.parameters.map((parameter) => parameter.name).join(', ')} with standard errors.`,
    // Stacked, so the chart fits a half-width column with its legend.
    vconcat: panels,
    spacing: 18,
    resolve: { scale: { x: 'independent' } },
  };
}
