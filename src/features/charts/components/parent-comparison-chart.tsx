import { useMemo } from 'react';
import type { CombinedValueDto, ConditionComparisonDto } from '@shared/schemas/comparison';
import { parentComparisonSpec, type ValueWithError } from '../specs/parent-comparison-spec';
import { VegaChart } from './vega-chart';

export interface ParentComparisonChartProps {
  comparison: ConditionComparisonDto;
  variantLabel: string;
  parentLabel: string;
}

const withError = (combined: CombinedValueDto<string> | null): ValueWithError | null =>
  combined === null ? null : { value: combined.value, se: combined.se, n: combined.n };

/** Km in the unit that keeps the larger of the two values between 1 and 1000 where it can. */
function kmUnit(values: readonly (number | undefined)[]): { unit: string; factor: number } {
  const largest = Math.max(0, ...values.filter((value): value is number => value !== undefined));
  if (largest >= 1e-3) return { unit: 'mM', factor: 1e3 };
  if (largest >= 1e-6) return { unit: 'µM', factor: 1e6 };
  return { unit: 'nM', factor: 1e9 };
}

/** The variant's kcat, Km and kcat/Km beside the condition-matched parent's, with standard errors. */
export function ParentComparisonChart({ comparison, variantLabel, parentLabel }: ParentComparisonChartProps) {
  const spec = useMemo(() => {
    const km = kmUnit([comparison.variant.km?.value, comparison.parent?.km?.value]);
    return parentComparisonSpec({
      title: `${variantLabel} against ${parentLabel}`,
      subtitle: `${comparison.substrate}, pH ${comparison.ph}, ${comparison.temperatureC} °C; error bars ± 1 SE (hidden behind the point when smaller); log axes.`,
      variantLabel,
      parentLabel,
      parameters: [
        { name: 'kcat', unit: 's⁻¹', factor: 1, variant: withError(comparison.variant.kcat), parent: withError(comparison.parent?.kcat ?? null) },
        { name: 'Km', unit: km.unit, factor: km.factor, variant: withError(comparison.variant.km), parent: withError(comparison.parent?.km ?? null) },
        { name: 'kcat/Km', unit: 'M⁻¹ s⁻¹', factor: 1, variant: withError(comparison.variant.kcatOverKm), parent: withError(comparison.parent?.kcatOverKm ?? null) },
      ],
    });
  }, [comparison, variantLabel, parentLabel]);
  return (
    <VegaChart
      spec={spec}
      title={`${variantLabel} against ${parentLabel} chart`}
      description={`kcat, Km and kcat/Km of ${variantLabel} and of ${parentLabel} under matched conditions, with standard errors.`}
      fileName={`${variantLabel}-against-parent`}
      heightClass="min-h-80"
    />
  );
}
