import { fitAssay, type AssayFit } from '@shared/assay/fit-assay';
import { compareModels, type ModelComparison } from '@shared/kinetics/compare-models';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import { plausibilityFlags, type PlausibilityFlag } from '@shared/kinetics/plausibility';
import type { ConcentrationUnitInput, CreateAssayInput, KineticModelName, RateUnitInput } from '@shared/schemas/assay';
import type { GridPoint } from './point-grid';

export const modelNames: Record<KineticModelName, string> = {
  'michaelis-menten': 'Michaelis–Menten',
  'substrate-inhibition': 'Substrate inhibition',
  hill: 'Hill',
};

/** One model's fit of the points, or why there is none. */
export interface ModelOutcome {
  model: KineticModelName;
  fit: AssayFit | null;
  error: string | null;
}

/** A richer model against Michaelis–Menten. */
export interface ComparisonOutcome {
  model: Exclude<KineticModelName, 'michaelis-menten'>;
  comparison: ModelComparison | null;
  error: string | null;
}

/** Everything the live preview shows. */
export interface AssayPreview {
  /** The points as POST /api/assays will receive them. */
  requestPoints: CreateAssayInput['points'];
  outcomes: Record<KineticModelName, ModelOutcome>;
  chosen: ModelOutcome;
  comparisons: ComparisonOutcome[];
  flags: PlausibilityFlag[];
  /** Without [E]t there is no kcat; Vmax and Km do not need it. */
  hasEnzyme: boolean;
  /** Time the fits, comparisons and flags took, ms. */
  elapsedMs: number;
}

// Vmax and Km do not depend on [E]t; without one the preview fits with this stand-in and shows neither
// kcat nor kcat/Km, so the stand-in never reaches the page.
const STAND_IN_ENZYME = { value: 1, unit: 'M' as const };

/**
 * The live fit of the entry grid: every model fitted with shared/assay/fit-assay exactly as the server will
 * fit the saved points (same points, same order, same units), Michaelis–Menten compared with substrate
 * inhibition and Hill, and the plausibility flags the server stores with the measurement.
 *
 * @param points the grid's points
 * @param options the units, [E]t (null when not entered yet) and the chosen model
 * @returns fits, comparisons, flags and the request points
 */
export function assayPreview(
  points: readonly GridPoint[],
  options: { sUnit: ConcentrationUnitInput; vUnit: RateUnitInput; enzymeConcentration: { value: number; unit: ConcentrationUnitInput } | null; model: KineticModelName },
): AssayPreview {
  const startedAt = performance.now();
  const requestPoints = points.map((point) => ({
    s: point.x,
    v: point.y,
    replicate: point.replicate,
    excluded: point.excluded,
    exclusionReason: point.excluded ? point.reason : null,
  }));
  const enzymeConcentration = options.enzymeConcentration ?? STAND_IN_ENZYME;
  const fitOne = (model: KineticModelName): ModelOutcome => {
    try {
      const fit = fitAssay(requestPoints, { model, sUnit: options.sUnit, vUnit: options.vUnit, enzymeConcentration });
      if (fit.nonPositive.length > 0) {
        // The server refuses such a fit with the same words.
        return { model, fit, error: `the ${modelNames[model]} fit gives a non-positive ${fit.nonPositive.join(' and ')}, so the model does not describe these points; exclude outliers or choose another model` };
      }
      return { model, fit, error: null };
    } catch (error) {
      if (error instanceof KineticsInputError) return { model, fit: null, error: error.message };
      throw error;
    }
  };
  const outcomes: Record<KineticModelName, ModelOutcome> = {
    'michaelis-menten': fitOne('michaelis-menten'),
    'substrate-inhibition': fitOne('substrate-inhibition'),
    hill: fitOne('hill'),
  };
  const simpler = outcomes['michaelis-menten'];
  const comparisons = (['substrate-inhibition', 'hill'] as const).map((model): ComparisonOutcome => {
    const richer = outcomes[model];
    if (!simpler.fit || !richer.fit) return { model, comparison: null, error: richer.error ?? simpler.error };
    try {
      return { model, comparison: compareModels(simpler.fit.fit, richer.fit.fit), error: null };
    } catch (error) {
      if (error instanceof KineticsInputError) return { model, comparison: null, error: error.message };
      throw error;
    }
  });
  const chosen = outcomes[options.model];
  const flags = chosen.fit && !chosen.error && options.enzymeConcentration ? measurementFlags(chosen.fit) : [];
  return { requestPoints, outcomes, chosen, comparisons, flags, hasEnzyme: options.enzymeConcentration !== null, elapsedMs: performance.now() - startedAt };
}

/** The flags the server stores with a fitted measurement, from the same inputs. */
function measurementFlags(fit: AssayFit): PlausibilityFlag[] {
  const measured = (estimate: { value: number; se: number } | null) =>
    estimate && Number.isFinite(estimate.value) && estimate.value > 0
      ? { value: estimate.value, se: Number.isFinite(estimate.se) ? estimate.se : undefined }
      : undefined;
  return plausibilityFlags({
    kcatPerSecond: measured(fit.parameters.kcat),
    kmMolar: measured(fit.parameters.km),
    kcatOverKmPerMolarSecond: measured(fit.parameters.kcatOverKm),
    substrateMolar: fit.substrateMolar.some((s) => s > 0) ? fit.substrateMolar : undefined,
  });
}
