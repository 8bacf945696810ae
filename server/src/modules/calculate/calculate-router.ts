import express, { Router } from 'express';
import { validate } from '../../middleware/validate';
import { HessBody, ParseBody } from './calculate-schemas';
import { combineSteps, describeEquation } from './calculate-service';

/** Public calculation routes: anonymous, rate-limited with the rest of the API, small bodies. */
export const CALCULATE_BODY_LIMIT = '10kb';

export function calculateRouter(): Router {
  const router = Router();
  router.use(['/equations', '/hess'], express.json({ limit: CALCULATE_BODY_LIMIT }));

  const parse = validate({ body: ParseBody });
  router.post('/equations/parse', parse, (_req, res) => {
    res.json(describeEquation(parse.input(res).body.equation));
  });

  const solve = validate({ body: HessBody });
  router.post('/hess/solve', solve, (_req, res) => {
    res.json(combineSteps(solve.input(res).body));
  });
  return router;
}

/** Equation parsing and Hess combination (mounted under /api/v1). */
export function createCalculateModule() {
  return { router: calculateRouter() };
}
