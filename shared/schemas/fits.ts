import { z } from 'zod';
import { finiteNumber } from './finite-number';

/** Most points one fit request may carry (a plate-reader export is far below this). */
export const MAX_FIT_POINTS = 10_000;

const NUMBER_WORDS = ['zero', 'one', 'two', 'three', 'four'];

// JSON has no NaN or Infinity, and zod 4's number refuses them too; the message covers both cases.

const ratePoint = z.object({
  s: finiteNumber().nonnegative('must be at least 0'),
  v: finiteNumber(),
  weight: finiteNumber().positive('must be greater than 0').optional(),
});

const phPoint = z.object({
  ph: finiteNumber(),
  k: finiteNumber(),
  weight: finiteNumber().positive('must be greater than 0').optional(),
});

/**
 * The preconditions the fit functions enforce, checked here as well so that bad input is a 400 with a
 * field message before any arithmetic runs: p + 1 distinct x values, a non-zero response, and weights on
 * every point or none. The wording matches the engine's KineticsInputError messages.
 */
function checkCurvePoints<T extends { weight?: number }>(
  points: readonly T[],
  x: (point: T) => number,
  y: (point: T) => number,
  parameterCount: number,
  nouns: { x: string; y: string },
  context: z.RefinementCtx,
): void {
  const required = parameterCount + 1;
  if (new Set(points.map(x)).size < required) {
    context.addIssue({
      code: 'custom',
      path: ['points'],
      message: `must contain at least ${NUMBER_WORDS[required]} points with distinct ${nouns.x}`,
    });
  }
  if (points.length > 0 && points.every((point) => y(point) === 0)) {
    context.addIssue({ code: 'custom', path: ['points'], message: `must contain at least one non-zero ${nouns.y}` });
  }
  const weighted = points.filter((point) => point.weight !== undefined).length;
  if (weighted !== 0 && weighted !== points.length) {
    context.addIssue({ code: 'custom', path: ['points'], message: 'must give a weight on every point or on none' });
  }
}

const ratePoints = z
  .array(ratePoint, { error: 'must be an array of points' })
  .max(MAX_FIT_POINTS, `must have at most ${MAX_FIT_POINTS} points`);

const RATE_NOUNS = { x: 'substrate concentrations', y: 'rate' };

/** Body of POST /api/fits/michaelis-menten. */
export const michaelisMentenFitInput = z
  .strictObject({
    points: ratePoints,
    enzymeConcentration: finiteNumber().positive('must be greater than 0').optional(),
  })
  .superRefine((body, context) =>
    checkCurvePoints(body.points, (point) => point.s, (point) => point.v, 2, RATE_NOUNS, context),
  );
export type MichaelisMentenFitInput = z.infer<typeof michaelisMentenFitInput>;

/** Body of POST /api/fits/substrate-inhibition. */
export const substrateInhibitionFitInput = z
  .strictObject({ points: ratePoints })
  .superRefine((body, context) =>
    checkCurvePoints(body.points, (point) => point.s, (point) => point.v, 3, RATE_NOUNS, context),
  );
export type SubstrateInhibitionFitInput = z.infer<typeof substrateInhibitionFitInput>;

/** Body of POST /api/fits/hill. */
export const hillFitInput = z
  .strictObject({ points: ratePoints })
  .superRefine((body, context) =>
    checkCurvePoints(body.points, (point) => point.s, (point) => point.v, 3, RATE_NOUNS, context),
  );
export type HillFitInput = z.infer<typeof hillFitInput>;

/** Body of POST /api/fits/ph-profile. */
export const phProfileFitInput = z
  .strictObject({
    points: z
      .array(phPoint, { error: 'must be an array of points' })
      .max(MAX_FIT_POINTS, `must have at most ${MAX_FIT_POINTS} points`),
    model: z.enum(['bell', 'acid', 'base'], { error: "must be 'bell', 'acid' or 'base'" }),
  })
  .superRefine((body, context) =>
    checkCurvePoints(
      body.points,
      (point) => point.ph,
      (point) => point.k,
      body.model === 'bell' ? 3 : 2,
      { x: 'pH values', y: 'rate constant' },
      context,
    ),
  );
export type PhProfileFitInput = z.infer<typeof phProfileFitInput>;
