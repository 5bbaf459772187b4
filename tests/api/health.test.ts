import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../setup/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('answers 200 with the database kind without a session', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: process.env.TEST_DATABASE_URL ? 'postgres' : 'pglite' });
  });

  it('answers unknown API paths with 401 before sign-in and the error shape', async () => {
    const res = await request(t.app).get('/api/nothing-here');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });
});
