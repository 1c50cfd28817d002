import { Router, type RequestHandler } from 'express';
import type { z } from 'zod';
import { fitHill } from '@shared/kinetics/fit-hill';
import { fitMichaelisMenten } from '@shared/kinetics/fit-michaelis-menten';
import { fitPhProfile } from '@shared/kinetics/fit-ph-profile';
import { fitSubstrateInhibition } from '@shared/kinetics/fit-substrate-inhibition';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import { hillFitInput, michaelisMentenFitInput, phProfileFitInput, substrateInhibitionFitInput } from '@shared/schemas/fits';
import { requirePermission } from '../../http/auth';
import { badRequest } from '../../http/errors';
import { parseOrThrow } from '../../http/validate';

/**
 * A fit endpoint: validates the body with the shared schema and answers with the engine's result. Input
 * the schema lets through but the engine still refuses is a 400 with the engine's message on `points`.
 */
function fitRoute<S extends z.ZodType>(schema: S, fit: (input: z.infer<S>) => unknown): RequestHandler {
  return (req, res) => {
    const input = parseOrThrow(schema, req.body ?? {});
    try {
      res.json(fit(input));
    } catch (error) {
      if (error instanceof KineticsInputError) throw badRequest(`The points cannot be fitted: ${error.message}.`, { points: error.message });
      throw error;
    }
  };
}

/** `/api/fits/*`: stateless fits for live previews and scripts; any signed-in role. */
export function fitsRouter(): Router {
  const router = Router();
  router.use(requirePermission('read'));

  router.post(
    '/michaelis-menten',
    fitRoute(michaelisMentenFitInput, (input) =>
      fitMichaelisMenten(input.points, input.enzymeConcentration === undefined ? {} : { enzymeConcentration: input.enzymeConcentration }),
    ),
  );
  router.post('/substrate-inhibition', fitRoute(substrateInhibitionFitInput, (input) => fitSubstrateInhibition(input.points)));
  router.post('/hill', fitRoute(hillFitInput, (input) => fitHill(input.points)));
  router.post('/ph-profile', fitRoute(phProfileFitInput, (input) => fitPhProfile(input.points, { model: input.model })));

  return router;
}
