import { useMemo } from 'react';
import type { FitResult } from '@shared/kinetics/types';
import { fittedCurve } from '../fitted-curve';
import { michaelisMentenSpec, type RatePointDatum } from '../specs/michaelis-menten-spec';
import { residualsSpec } from '../specs/residuals-spec';
import { linearGrid } from '../specs/spec-parts';
import { VegaChart } from './vega-chart';

export interface AssayFitChartsProps {
  points: readonly RatePointDatum[];
  /** The fit in the units the points are in; null draws the points alone. */
  fit: FitResult | null;
  curveLabel: string;
  sUnit: string;
  vUnit: string;
  /** Names the charts and their downloads, e.g. the variant's label. */
  subject?: string;
  subtitle?: string;
  onPointClick?: (key: string) => void;
}

/** Points along the substrate axis at which the curve is drawn. */
const CURVE_POINTS = 120;

/**
 * The Michaelis–Menten plot (points by replicate, the fit and its 95 % band) and the residual plot of one
 * assay. Used live on the entry page and for stored assays on the Variant page.
 */
export function AssayFitCharts({ points, fit, curveLabel, sUnit, vUnit, subject, subtitle, onPointClick }: AssayFitChartsProps) {
  const specs = useMemo(() => {
    let highestS = 0;
    for (const point of points) highestS = Math.max(highestS, point.s);
    const curve = fit ? fittedCurve(fit, linearGrid(0, highestS * 1.05, CURVE_POINTS)) : { points: [], hasBand: false };
    const atPoints = fit ? fittedCurve(fit, points.map((point) => point.s)).points : [];
    const clickable = onPointClick !== undefined;
    const rate = michaelisMentenSpec({
      title: subject ? `${subject}: initial rate against [S]` : 'Initial rate against [S]',
      subtitle: subtitle ?? (fit && !curve.hasBand ? 'No confidence band: the fit’s covariance is singular.' : undefined),
      points,
      curve: curve.points,
      hasBand: curve.hasBand,
      curveLabel,
      sUnit,
      vUnit,
      clickable,
    });
    const residuals =
      atPoints.length === points.length
        ? residualsSpec({
            title: `${subject ? `${subject}: residuals` : 'Residuals'} of the ${curveLabel}`,
            points: points.map((point, index) => ({ ...point, residual: point.v - atPoints[index].y })),
            sUnit,
            vUnit,
            clickable,
          })
        : null;
    return { rate, residuals };
  }, [points, fit, curveLabel, sUnit, vUnit, subject, subtitle, onPointClick]);

  const handleClick = onPointClick
    ? (datum: Record<string, unknown>) => {
        if (typeof datum.key === 'string') onPointClick(datum.key);
      }
    : undefined;
  const fileBase = (subject ?? 'assay').toLowerCase();

  return (
    <div className="space-y-3">
      <VegaChart
        spec={specs.rate.spec}
        datasets={specs.rate.datasets}
        title={subject ? `${subject} Michaelis–Menten plot` : 'Michaelis–Menten plot'}
        description={`Initial rate v₀ (${vUnit}) against substrate concentration (${sUnit}) for ${points.length} points${fit ? `, with the ${curveLabel.toLowerCase()} and its 95 % confidence band` : ''}.`}
        fileName={`${fileBase}-michaelis-menten`}
        onDatumClick={handleClick}
        timingName="chart:michaelis-menten"
        heightClass="min-h-80"
      />
      {specs.residuals && (
        <VegaChart
          spec={specs.residuals.spec}
          datasets={specs.residuals.datasets}
          title={subject ? `${subject} residual plot` : 'Residual plot'}
          description={`Residuals, observed minus fitted v₀ (${vUnit}), against substrate concentration.`}
          fileName={`${fileBase}-residuals`}
          onDatumClick={handleClick}
          heightClass="min-h-52"
        />
      )}
    </div>
  );
}
