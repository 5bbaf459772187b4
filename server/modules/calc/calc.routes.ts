import express, { Router, type Response } from 'express';
import { CALC_METHODS, type CalcMethod } from '../../../src/shared/constants';
import { isCalcMethod, runCalc } from '../../../src/shared/domain/calc';
import { isDomainError } from '../../../src/shared/domain/domain-error';
import { getActor } from '../../lib/actor';
import { AppError } from '../../lib/app-error';
import type { ComputePool } from '../../lib/compute/compute-pool';
import type { ComputeOutcome } from '../../lib/compute/compute-protocol';
import { computeStreamedJson, computeSurveyUpload, INLINE_BODY_BYTES, isSmallBody } from './calc-bodies';

const inlineJson = express.json({ limit: INLINE_BODY_BYTES });

function send(res: Response, outcome: ComputeOutcome) {
  if (!outcome.ok) throw new AppError(outcome.status, outcome.code, outcome.message, outcome.details);
  res.type('application/json').send(outcome.json);
}

/** Small bodies: parsed and computed here, on the request thread (a worker round trip would cost more). */
function computeInline(method: CalcMethod, body: unknown): ComputeOutcome {
  try {
    return { ok: true, json: JSON.stringify(runCalc(method, body)) };
  } catch (err) {
    if (!isDomainError(err)) throw err;
    return {
      ok: false,
      status: err.code === 'UNKNOWN_CALC_METHOD' ? 404 : 400,
      code: err.code,
      message: err.message,
      details: err.issues,
    };
  }
}

/**
 * POST /api/calc/:method: the quantity engine for scripts and integrations (signed-in users). Pure computation:
 * nothing is read or written. Bodies over INLINE_BODY_BYTES, and surveys uploaded as files, are parsed and computed
 * in the compute pool's worker threads, so no calculation holds other requests. 400 with field paths for bad input,
 * 404 for an unknown method, 413 over the method's body limit, 503 with Retry-After when the pool is full or the
 * calculation runs past its time limit.
 */
export function calcRouter(compute: ComputePool): Router {
  const router = Router();
  router.post('/calc/:method', async (req, res, next) => {
    getActor(res);
    const method = String(req.params.method);
    if (!isCalcMethod(method)) {
      req.resume();
      throw new AppError(404, 'UNKNOWN_CALC_METHOD', `Unknown calculation method "${method}".`, [
        { path: 'method', message: `Use one of: ${CALC_METHODS.join(', ')}` },
      ]);
    }
    if (method === 'surface' && req.is('multipart/form-data'))
      return send(res, await computeSurveyUpload(compute, req, res));
    if (!isSmallBody(req)) return send(res, await computeStreamedJson(compute, method, req, res));
    inlineJson(req, res, (err?: unknown) => {
      if (err) return next(err);
      try {
        send(res, computeInline(method, req.body));
      } catch (e) {
        next(e);
      }
    });
  });
  return router;
}
