import express, { Router } from 'express';
import { parseWith } from '../../middleware/validate';
import { HessBody, ParseBody } from './calculate-schemas';
import { combineSteps, describeEquation } from './calculate-service';

/** Public calculation routes: anonymous, rate-limited with the rest of the API, small bodies. */
export const CALCULATE_BODY_LIMIT = '10kb';
export const CALCULATE_PATHS = ['/api/v1/equations', '/api/v1/hess'];
export const calculateBodyParser = express.json({ limit: CALCULATE_BODY_LIMIT });

export function calculateRouter(): Router {
  const router = Router();
  router.post('/equations/parse', (req, res) => {
    const { equation } = parseWith(ParseBody, req.body);
    res.json(describeEquation(equation));
  });
  router.post('/hess/solve', (req, res) => {
    res.json(combineSteps(parseWith(HessBody, req.body)));
  });
  return router;
}
