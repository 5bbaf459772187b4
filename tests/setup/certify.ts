import type { Express } from 'express';
import { expect } from 'vitest';
import { signedInAgent, TEST_PASSWORD } from './test-app';

type CompiledApp = { id: string; revision: number; lines: { id: string }[] };
type People = { subcontractor: string; generalContractor: string };

/**
 * Through the API as the general contractor would: approve every line of a submitted application, acknowledge its
 * flags and certify it. Returns the certified application.
 */
export async function approveAndCertify(app: Express, generalContractor: string, payApp: CompiledApp) {
  const gc = await signedInAgent(app, generalContractor);
  const lines = payApp.lines.map((l) => ({ lineId: l.id, decision: 'approve' }));
  const reviewed = await gc
    .post(`/api/pay-apps/${payApp.id}/review`)
    .send({ expectedRevision: payApp.revision, lines });
  expect(reviewed.status).toBe(200);
  const flags = (await gc.get(`/api/pay-apps/${payApp.id}`)).body.payApp.flags as { key: string }[];
  const res = await gc.post(`/api/pay-apps/${payApp.id}/certify`).send({
    expectedRevision: payApp.revision,
    reauthPassword: TEST_PASSWORD,
    acknowledgedFlags: flags.map((f) => f.key),
  });
  expect(res.status).toBe(200);
  return res.body.payApp;
}

/** The subcontractor submits the compiled application, then the general contractor approves and certifies it. */
export async function submitAndCertify(app: Express, people: People, payApp: CompiledApp) {
  const sub = await signedInAgent(app, people.subcontractor);
  const submitted = await sub.post(`/api/pay-apps/${payApp.id}/submit`).send({ expectedRevision: payApp.revision });
  expect(submitted.status).toBe(200);
  return approveAndCertify(app, people.generalContractor, payApp);
}
