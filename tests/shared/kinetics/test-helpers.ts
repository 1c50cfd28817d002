import { readFileSync } from 'node:fs';

/** |actual − expected| / |expected|. */
export function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

/** NIST StRD's log relative error, −log₁₀(|actual − certified| / |certified|): the number of matching digits. */
export function logRelativeError(actual: number, certified: number): number {
  return -Math.log10(relativeError(actual, certified));
}

/** Every number inside a value (objects and arrays, recursively), to check that none is NaN. */
export function allNumbers(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (Array.isArray(value)) return value.flatMap(allNumbers);
  if (value !== null && typeof value === 'object') return Object.values(value).flatMap(allNumbers);
  return [];
}

/** Deep-freezes test data so that any mutation by the code under test throws (tests run in strict mode). */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const inner of Object.values(value)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}

export type FixtureEstimate = { value: number; se: number };
export type ScipyFixtureSet<Point> = {
  points: Point[];
  truth: Record<string, number>;
  expected: Record<string, FixtureEstimate>;
  rss: number;
  df: number;
};

/** A fixture written by tests/fixtures/kinetics/generate_scipy_fixtures.py. */
export function loadScipyFixture<T>(name: string): T {
  return JSON.parse(readFileSync(new URL(`../../fixtures/kinetics/scipy-${name}.json`, import.meta.url), 'utf8')) as T;
}

/**
 * Checks an analytic Jacobian against central finite differences at the given parameters; returns the
 * largest error relative to the largest derivative magnitude of each column.
 */
export function jacobianError(
  curve: (x: ArrayLike<number>, parameters: ArrayLike<number>, values: number[], jacobian: number[] | null) => void,
  x: readonly number[],
  parameters: readonly number[],
): number {
  const n = x.length;
  const p = parameters.length;
  const values = new Array<number>(n).fill(0);
  const jacobian = new Array<number>(n * p).fill(0);
  curve(x, parameters, values, jacobian);
  let worst = 0;
  for (let j = 0; j < p; j += 1) {
    const step = 1e-6 * Math.max(Math.abs(parameters[j]), 1e-3);
    const up = parameters.slice();
    const down = parameters.slice();
    up[j] += step;
    down[j] -= step;
    const valuesUp = new Array<number>(n).fill(0);
    const valuesDown = new Array<number>(n).fill(0);
    curve(x, up, valuesUp, null);
    curve(x, down, valuesDown, null);
    let columnScale = 0;
    for (let i = 0; i < n; i += 1) columnScale = Math.max(columnScale, Math.abs(jacobian[i * p + j]));
    for (let i = 0; i < n; i += 1) {
      const numeric = (valuesUp[i] - valuesDown[i]) / (2 * step);
      worst = Math.max(worst, Math.abs(numeric - jacobian[i * p + j]) / columnScale);
    }
  }
  return worst;
}
