import { KineticsInputError } from './kinetics-input-error';
import type { PhPoint, RatePoint } from './types';

/** Validated data for a least-squares curve fit; `weightRoot` holds √wᵢ, or null for an unweighted fit. */
export type CurveData = { x: number[]; y: number[]; weightRoot: number[] | null };

const NUMBER_WORDS = ['zero', 'one', 'two', 'three', 'four', 'five'];

const AXES = {
  rate: {
    x: (point: RatePoint) => point.s,
    y: (point: RatePoint) => point.v,
    xNonNegative: true,
    xRequirement: 'finite, non-negative substrate concentrations',
    xDistinct: 'substrate concentrations',
    yRequirement: 'finite rates',
    yNonZero: 'rate',
  },
  ph: {
    x: (point: PhPoint) => point.ph,
    y: (point: PhPoint) => point.k,
    xNonNegative: false,
    xRequirement: 'finite pH values',
    xDistinct: 'pH values',
    yRequirement: 'finite rate constants',
    yNonZero: 'rate constant',
  },
} as const;

/**
 * Checks the points of a curve fit and copies them into plain arrays.
 *
 * A model with p parameters needs at least p + 1 distinct x values: p to determine the curve and one more
 * so that there is a residual degree of freedom for the standard errors (so df ≥ 1 in every fit).
 *
 * @param functionName the public function on whose behalf the check runs (it starts every message)
 * @param kind `'rate'` for {s, v} points (S ≥ 0) or `'ph'` for {ph, k} points
 * @param points the data, never modified
 * @param parameterCount number of parameters of the model to be fitted
 * @throws {KineticsInputError} non-finite (or, for S, negative) x; non-finite y; all y zero; weights on
 *   some points but not all; a non-finite or non-positive weight; fewer than p + 1 distinct x values
 * @returns x, y and √weight as arrays in input order
 * @example
 * const points = [{ s: 1, v: 1 }, { s: 2, v: 1.5 }, { s: 4, v: 1.8 }];
 * validateCurvePoints('fitMichaelisMenten', 'rate', points, 2).x; // [1, 2, 4]
 */
export function validateCurvePoints(
  functionName: string,
  kind: 'rate',
  points: readonly RatePoint[],
  parameterCount: number,
): CurveData;
export function validateCurvePoints(
  functionName: string,
  kind: 'ph',
  points: readonly PhPoint[],
  parameterCount: number,
): CurveData;
export function validateCurvePoints(
  functionName: string,
  kind: 'rate' | 'ph',
  points: readonly (RatePoint | PhPoint)[],
  parameterCount: number,
): CurveData {
  const axes = AXES[kind];
  const readX = axes.x as (point: RatePoint | PhPoint) => number;
  const readY = axes.y as (point: RatePoint | PhPoint) => number;
  const n = points.length;
  const x = new Array<number>(n).fill(0);
  const y = new Array<number>(n).fill(0);
  const weighted = n > 0 && points[0].weight !== undefined;
  const weightRoot = weighted ? new Array<number>(n).fill(0) : null;
  let anyNonZero = false;

  for (let i = 0; i < n; i += 1) {
    const point = points[i];
    const xi = readX(point);
    const yi = readY(point);
    if (!Number.isFinite(xi) || (axes.xNonNegative && xi < 0)) {
      throw new KineticsInputError(`${functionName} requires ${axes.xRequirement} (points[${i}])`);
    }
    if (!Number.isFinite(yi)) {
      throw new KineticsInputError(`${functionName} requires ${axes.yRequirement} (points[${i}])`);
    }
    const weight = point.weight;
    if ((weight !== undefined) !== weighted) {
      throw new KineticsInputError(`${functionName} requires a weight on every point or on none`);
    }
    if (weightRoot !== null) {
      if (weight === undefined || !Number.isFinite(weight) || weight <= 0) {
        throw new KineticsInputError(`${functionName} requires finite, positive weights (points[${i}])`);
      }
      weightRoot[i] = Math.sqrt(weight);
    }
    x[i] = xi;
    y[i] = yi;
    if (yi !== 0) anyNonZero = true;
  }

  const required = parameterCount + 1;
  if (countDistinct(x, required) < required) {
    throw new KineticsInputError(
      `${functionName} requires at least ${NUMBER_WORDS[required]} points with distinct ${axes.xDistinct}`,
    );
  }
  if (!anyNonZero) {
    throw new KineticsInputError(`${functionName} requires at least one non-zero ${axes.yNonZero}`);
  }
  return { x, y, weightRoot };
}

/** Number of distinct values, counting no further than `enough` (the usual data set is small). */
function countDistinct(values: number[], enough: number): number {
  const seen: number[] = [];
  for (let i = 0; i < values.length && seen.length < enough; i += 1) {
    if (!seen.includes(values[i])) seen.push(values[i]);
  }
  return seen.length;
}
