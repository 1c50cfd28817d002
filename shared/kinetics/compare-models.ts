import jStat from 'jstat';

import { KineticsInputError } from './kinetics-input-error';
import type { FitResult } from './types';

/** The F test's significance level for preferring the richer model. */
export const F_TEST_ALPHA = 0.05;

/** One model's side of a comparison. */
export type ModelScore = { aicc: number; rss: number; parameterCount: number };

/** The outcome of {@link compareModels}. */
export type ModelComparison = {
  simpler: ModelScore;
  richer: ModelScore;
  /** AICc(richer) − AICc(simpler); negative favours the richer model. */
  deltaAicc: number;
  /** Akaike weight of the richer model among the two, 1/(1 + exp(ΔAICc/2)). */
  richerAkaikeWeight: number;
  fStatistic: number;
  fDegreesOfFreedom: [number, number];
  /** P(F ≥ observed) under the simpler model. */
  pValue: number;
  preferred: 'simpler' | 'richer';
  reason: string;
  warnings: string[];
};

/**
 * Compares two nested least-squares fits of the same data (e.g. Michaelis–Menten inside substrate
 * inhibition, Ki → ∞, or inside Hill, n = 1) by the small-sample Akaike criterion and the
 * extra-sum-of-squares F test, and says which model the data support.
 *
 * - AICc = n·ln(RSS/n) + 2K + 2K(K + 1)/(n − K − 1), with K = p + 1 counting the residual variance
 *   (Burnham & Anderson); only differences between models mean anything.
 * - F = ((RSS₁ − RSS₂)/(df₁ − df₂)) / (RSS₂/df₂) on (df₁ − df₂, df₂) degrees of freedom; the p-value is
 *   the upper tail, I_x(df₂/2, (df₁ − df₂)/2) with x = df₂/(df₂ + (df₁ − df₂)·F), computed directly
 *   rather than as 1 − CDF so that small p-values keep their digits.
 *
 * The richer model is preferred only when both agree: lower AICc and p < 0.05. Otherwise the simpler model
 * stands, because an extra parameter the data do not clearly need only widens every other error. (Ki → ∞
 * lies on the boundary of the parameter space, where the F test is approximate; common practice accepts
 * that.) With weighted fits RSS is the weighted sum, as it should be.
 *
 * Reference: Burnham & Anderson, Model Selection and Multimodel Inference, 2nd ed. (2002); Hurvich &
 * Tsai, Biometrika 76 (1989) 297 (AICc); Bates & Watts, Nonlinear Regression Analysis and Its
 * Applications (1988) (extra sum of squares).
 *
 * @param simpler the fit with fewer parameters
 * @param richer the fit with more parameters, of the same data
 * @throws {KineticsInputError} different numbers of points, a richer model that does not have more
 *   parameters, fewer than p + 3 points for the richer model's p (AICc is undefined there), or an exact
 *   fit (RSS = 0, for which neither criterion is defined)
 * @returns both scores, ΔAICc, the richer model's Akaike weight, F, its degrees of freedom, the p-value, the
 *   preferred model with the reason, and warnings
 * @example
 * // Fits of the same 10 points, RSS 20 with 2 parameters (df 8) and RSS 10 with 3 (df 7):
 * // F = (10/1)/(10/7) = 7 on (1, 7) df, p = 0.0332; AICc 16.93 against 16.00.
 * compareModels(michaelisMentenFit, substrateInhibitionFit).preferred; // 'richer'
 */
export function compareModels(simpler: FitResult, richer: FitResult): ModelComparison {
  const n = simpler.n;
  if (richer.n !== n) {
    throw new KineticsInputError('compareModels requires two fits of the same data points');
  }
  const simplerParameters = n - simpler.df;
  const richerParameters = n - richer.df;
  if (richerParameters <= simplerParameters) {
    throw new KineticsInputError('compareModels requires the richer model to have more parameters');
  }
  if (n < richerParameters + 3) {
    throw new KineticsInputError(
      `compareModels requires at least ${richerParameters + 3} points for AICc with ${richerParameters} parameters`,
    );
  }
  if (!(simpler.rss > 0 && richer.rss > 0)) {
    throw new KineticsInputError('compareModels requires fits with a non-zero residual sum of squares');
  }

  const warnings: string[] = [];
  if (!simpler.converged || !richer.converged) {
    warnings.push('at least one of the fits did not converge, so the comparison is not reliable');
  }

  const simplerScore = score(simpler.rss, n, simplerParameters);
  const richerScore = score(richer.rss, n, richerParameters);
  const deltaAicc = richerScore.aicc - simplerScore.aicc;

  // Extra-sum-of-squares F test.
  const numeratorDf = simpler.df - richer.df;
  const denominatorDf = richer.df;
  const fStatistic = (simpler.rss - richer.rss) / numeratorDf / (richer.rss / denominatorDf);
  let pValue = 1;
  if (fStatistic > 0) {
    const x = denominatorDf / (denominatorDf + numeratorDf * fStatistic);
    pValue = jStat.ibeta(x, denominatorDf / 2, numeratorDf / 2);
  } else {
    warnings.push('the richer model fits no better than the simpler one; its fit may not have reached the optimum');
  }

  const aiccFavoursRicher = deltaAicc < 0;
  const fTestFavoursRicher = pValue < F_TEST_ALPHA;
  const preferred = aiccFavoursRicher && fTestFavoursRicher ? 'richer' : 'simpler';
  const aiccText = `ΔAICc = ${deltaAicc.toFixed(2)}`;
  const fText = `F test p = ${pValue.toPrecision(2)}`;
  let reason: string;
  if (preferred === 'richer') {
    reason = `the richer model is supported: lower AICc (${aiccText}) and ${fText} < ${F_TEST_ALPHA}`;
  } else if (!aiccFavoursRicher && !fTestFavoursRicher) {
    reason = `the extra parameter is not supported: ${aiccText} and ${fText}`;
  } else {
    reason = `the criteria disagree (${aiccText}, ${fText}), so the simpler model stands`;
  }

  return {
    simpler: simplerScore,
    richer: richerScore,
    deltaAicc,
    richerAkaikeWeight: 1 / (1 + Math.exp(deltaAicc / 2)),
    fStatistic,
    fDegreesOfFreedom: [numeratorDf, denominatorDf],
    pValue,
    preferred,
    reason,
    warnings,
  };
}

/** AICc of a least-squares fit with p parameters plus the variance: K = p + 1. */
function score(rss: number, n: number, parameterCount: number): ModelScore {
  const k = parameterCount + 1;
  return { aicc: n * Math.log(rss / n) + 2 * k + (2 * k * (k + 1)) / (n - k - 1), rss, parameterCount };
}
