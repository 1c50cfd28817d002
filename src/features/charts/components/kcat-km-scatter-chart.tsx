import { useMemo } from 'react';
import type { VariantListRowDto } from '@shared/schemas/variant';
import { kcatKmScatterSpec } from '../specs/kcat-km-scatter-spec';
import { counted } from '../specs/spec-parts';
import { VegaChart } from './vega-chart';

export interface KcatKmScatterChartProps {
  /** Variants with their summary kcat and Km (others are left out). */
  variants: readonly VariantListRowDto[];
  campaignName: string;
  note?: string;
  onOpenVariant: (variantId: number) => void;
}

/** kcat against Km of a campaign's variants, on log axes with lines of equal kcat/Km. */
export function KcatKmScatterChart({ variants, campaignName, note, onOpenVariant }: KcatKmScatterChartProps) {
  const points = useMemo(
    () =>
      variants
        .filter((variant) => variant.kcat !== null && variant.km !== null && variant.kcat.value > 0 && variant.km.value > 0)
        .map((variant) => ({
          variantId: variant.id,
          label: variant.label,
          kcatPerSecond: variant.kcat!.value,
          kmMolar: variant.km!.value,
          isParent: variant.isParent,
          mutationCount: variant.mutations.length,
        })),
    [variants],
  );
  const spec = useMemo(
    () => kcatKmScatterSpec({ title: 'kcat against Km', subtitle: `${campaignName}: ${counted(points.length, 'variant')}${note ? `; ${note}` : ''}. Dashed lines: equal kcat/Km.`, points }),
    [points, campaignName, note],
  );
  return (
    <VegaChart
      spec={spec}
      title="kcat against Km scatter plot"
      description={`kcat against Km on logarithmic axes for ${counted(points.length, 'variant')}, with lines of equal kcat/Km and the region near the diffusion limit shaded.`}
      fileName={`${campaignName}-kcat-km`}
      heightClass="min-h-96"
      onDatumClick={(datum) => {
        if (typeof datum.variantId === 'number') onOpenVariant(datum.variantId);
      }}
    />
  );
}
