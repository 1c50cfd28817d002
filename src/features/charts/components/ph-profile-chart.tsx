import { useMemo } from 'react';
import type { FitResult } from '@shared/kinetics/types';
import { fittedCurve } from '../fitted-curve';
import { phProfileSpec, type PhMarker, type PhPointDatum } from '../specs/ph-profile-spec';
import { linearGrid } from '../specs/spec-parts';
import { VegaChart } from './vega-chart';

export interface PhProfileChartProps {
  points: readonly PhPointDatum[];
  /** The fit in the unit of the points; null draws the points alone. */
  fit: FitResult | null;
  curveLabel: string;
  /** The rate's axis title with its unit, e.g. `kcat (s⁻¹)`. */
  rateTitle: string;
  pkas: readonly PhMarker[];
  optimum: PhMarker | null;
  subject?: string;
  subtitle?: string;
  onPointClick?: (key: string) => void;
}

const CURVE_POINTS = 120;
/** The curve reaches this far beyond the lowest and highest pH measured. */
const PH_MARGIN = 0.3;

/** A pH–rate profile with its fit, 95 % band, pKa markers and the pH optimum. */
export function PhProfileChart({ points, fit, curveLabel, rateTitle, pkas, optimum, subject, subtitle, onPointClick }: PhProfileChartProps) {
  const chart = useMemo(() => {
    let lowest = Number.POSITIVE_INFINITY;
    let highest = Number.NEGATIVE_INFINITY;
    for (const point of points) {
      lowest = Math.min(lowest, point.ph);
      highest = Math.max(highest, point.ph);
    }
    const curve = fit && points.length > 0 ? fittedCurve(fit, linearGrid(Math.max(0, lowest - PH_MARGIN), Math.min(14, highest + PH_MARGIN), CURVE_POINTS)) : { points: [], hasBand: false };
    return phProfileSpec({
      title: `${subject ? `${subject}: ` : ''}pH–rate profile`,
      subtitle: subtitle ?? (fit && !curve.hasBand ? 'No confidence band: the fit’s covariance is singular.' : undefined),
      points,
      curve: curve.points,
      hasBand: curve.hasBand,
      curveLabel,
      rateTitle,
      pkas,
      optimum,
      clickable: onPointClick !== undefined,
    });
  }, [points, fit, curveLabel, rateTitle, pkas, optimum, subject, subtitle, onPointClick]);

  return (
    <VegaChart
      spec={chart.spec}
      datasets={chart.datasets}
      title={subject ? `${subject} pH–rate profile` : 'pH–rate profile'}
      description={`${rateTitle} against pH for ${points.length} points${pkas.length > 0 ? `; fitted ${pkas.map((pka) => `${pka.label} ${pka.value.toFixed(2)}`).join(', ')}` : ''}${optimum ? `; pH optimum ${optimum.value.toFixed(2)}` : ''}.`}
      fileName={`${(subject ?? 'ph-profile').toLowerCase()}-ph-profile`}
      onDatumClick={onPointClick ? (datum) => typeof datum.key === 'string' && onPointClick(datum.key) : undefined}
      timingName="chart:ph-profile"
      heightClass="min-h-80"
    />
  );
}
