import express, { Router } from 'express';
import { CALC_METHODS } from '../../../src/shared/constants';
import { isCalcMethod, runCalc } from '../../../src/shared/domain/calc';
import { isDomainError } from '../../../src/shared/domain/domain-error';
import { getActor } from '../../lib/actor';
import { AppError } from '../../lib/app-error';

/** Surfaces of up to 1,000,000 points each arrive as JSON: this route alone takes bodies up to this size. */
export const CALC_BODY_LIMIT = '128mb';

/**
 * POST /api/calc/:method: the quantity engine for scripts and integrations (signed-in users). Pure computation:
 * nothing is read or written. 400 with field paths for bad input, 404 for an unknown method.
 */
export function calcRouter(): Router {
  const router = Router();
  router.post('/calc/:method', express.json({ limit: CALC_BODY_LIMIT }), (req, res) => {
    getActor(res);
    const method = String(req.params.method);
    if (!isCalcMethod(method)) {
      throw new AppError(404, 'UNKNOWN_CALC_METHOD', `Unknown calculation method "${method}".`, [
        { path: 'method', message: `Use one of: ${CALC_METHODS.join(', ')}` },
      ]);
    }
    try {
      res.json(runCalc(method, req.body));
    } catch (err) {
      if (!isDomainError(err)) throw err;
      const status = err.code === 'UNKNOWN_CALC_METHOD' ? 404 : 400;
      throw new AppError(status, err.code, err.message, err.issues);
    }
  });
  return router;
}
