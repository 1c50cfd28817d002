import { useMemo } from 'react';
import type { CampaignLandscapeDto, LandscapeCellDto } from '@shared/schemas/comparison';
import { heatMapSpec } from '../specs/heat-map-spec';
import { counted } from '../specs/spec-parts';
import { VegaChart } from './vega-chart';

export interface HeatMapChartProps {
  landscape: CampaignLandscapeDto;
  /** The cells to draw (the landscape's, after the page's filters). */
  cells: readonly LandscapeCellDto[];
  campaignName: string;
  parentVariantId: number | null;
  onOpenVariant: (variantId: number) => void;
  /** Told each time the map has been drawn. */
  onDrawn?: () => void;
}

/** Above this many cells the map is drawn on a canvas; below, as SVG, which is crisper. */
const CANVAS_FROM_CELLS = 2000;

/**
 * The position × amino-acid map of log10 fold change in kcat/Km. A deep mutational scan puts ten thousand
 * cells in it, which a canvas draws several times faster than SVG; downloads offer SVG either way.
 */
export function HeatMapChart({ landscape, cells, campaignName, parentVariantId, onOpenVariant, onDrawn }: HeatMapChartProps) {
  const chart = useMemo(
    () =>
      heatMapSpec({
        title: 'Fitness landscape: log₁₀ fold change in kcat/Km over the parent',
        subtitle: `${campaignName}: ${counted(cells.length, 'single substitution')} at ${counted(landscape.positions.length, 'position')}; click a cell to open the variant.`,
        aminoAcids: landscape.aminoAcids,
        positions: landscape.positions,
        cells,
        parentVariantId,
      }),
    [landscape, cells, campaignName, parentVariantId],
  );
  const measured = cells.filter((cell) => cell.log10FoldChange !== null).length;
  return (
    <VegaChart
      spec={chart.spec}
      datasets={chart.datasets}
      title="Fitness landscape heat map"
      description={`Heat map of ${counted(cells.length, 'single-substitution variant')} at ${counted(landscape.positions.length, 'position')}, ${measured} with a fold change in kcat/Km over the parent; catalytic positions are marked above the map.`}
      fileName={`${campaignName}-landscape`}
      renderer={cells.length > CANVAS_FROM_CELLS ? 'canvas' : 'svg'}
      scrollable
      timingName="chart:heat-map"
      heightClass="min-h-96"
      onDrawn={onDrawn}
      onDatumClick={(datum) => {
        if (typeof datum.variantId === 'number') onOpenVariant(datum.variantId);
      }}
    />
  );
}
