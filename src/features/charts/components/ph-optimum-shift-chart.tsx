import { useMemo } from 'react';
import type { VariantListRowDto } from '@shared/schemas/variant';
import { phOptimumShiftSpec } from '../specs/ph-optimum-shift-spec';
import { counted } from '../specs/spec-parts';
import { VegaChart } from './vega-chart';

export interface PhOptimumShiftChartProps {
  /** Variants with a pH optimum (the parent is the reference and left out). */
  variants: readonly VariantListRowDto[];
  parentPhOptimum: number;
  targetPh: number | null;
  campaignName: string;
  onOpenVariant: (variantId: number) => void;
}

/** Most variants listed; beyond, the largest shifts either way are kept. */
const MAX_ROWS = 60;

/** How far each variant's pH optimum moved from the parent's. */
export function PhOptimumShiftChart({ variants, parentPhOptimum, targetPh, campaignName, onOpenVariant }: PhOptimumShiftChartProps) {
  const points = useMemo(() => {
    const all = variants
      .filter((variant) => !variant.isParent && variant.phOptimum !== null)
      .map((variant) => ({ variantId: variant.id, label: variant.label, phOptimum: variant.phOptimum! }));
    if (all.length <= MAX_ROWS) return all;
    return [...all].sort((first, second) => Math.abs(second.phOptimum - parentPhOptimum) - Math.abs(first.phOptimum - parentPhOptimum)).slice(0, MAX_ROWS);
  }, [variants, parentPhOptimum]);
  const shown = points.length;
  const total = variants.filter((variant) => !variant.isParent && variant.phOptimum !== null).length;
  const spec = useMemo(
    () =>
      phOptimumShiftSpec({
        title: 'pH-optimum shift from the parent',
        subtitle: `${campaignName}: parent optimum pH ${parentPhOptimum.toFixed(2)}; ${shown < total ? `the ${shown} largest of ${total} shifts` : `${counted(shown, 'variant')} with a pH profile`}.`,
        parentPhOptimum,
        targetPh,
        points,
      }),
    [points, parentPhOptimum, targetPh, campaignName, shown, total],
  );
  return (
    <VegaChart
      spec={spec}
      title="pH-optimum shift chart"
      description={`Shift of the pH optimum from the parent's pH ${parentPhOptimum.toFixed(2)} for ${counted(shown, 'variant')}.`}
      fileName={`${campaignName}-ph-optimum-shift`}
      heightClass="min-h-60"
      onDatumClick={(datum) => {
        if (typeof datum.variantId === 'number') onOpenVariant(datum.variantId);
      }}
    />
  );
}
