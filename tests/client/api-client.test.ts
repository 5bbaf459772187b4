import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ApiError, isApiErrorBody, toApiError } from '@/lib/api-client';
import { apiErrorSchema } from '@/shared/schemas/api-error';

// The client checks the error shape by hand (zod stays out of the entry chunk); the shared zod schema is the
// reference it must agree with, on bodies of the right shape, near misses and anything at all.
const detail = fc.record(
  { path: fc.oneof(fc.string(), fc.integer()), message: fc.oneof(fc.string(), fc.constant(null)), line: fc.oneof(fc.integer(), fc.double(), fc.string()), column: fc.oneof(fc.string(), fc.integer()) },
  { requiredKeys: [] },
);
const body = fc.oneof(
  fc.record({ error: fc.record({ code: fc.oneof(fc.string(), fc.integer()), message: fc.oneof(fc.string(), fc.boolean()), details: fc.oneof(fc.array(detail, { maxLength: 3 }), fc.constant(null), fc.string()) }, { requiredKeys: [] }) }, { requiredKeys: [] }),
  fc.anything(),
);

describe('isApiErrorBody', () => {
  it('accepts exactly the bodies apiErrorSchema accepts', () => {
    let accepted = 0;
    fc.assert(
      fc.property(body, (b) => {
        const reference = apiErrorSchema.safeParse(b).success;
        if (reference) accepted++;
        return isApiErrorBody(b) === reference;
      }),
      { numRuns: 2000 },
    );
    expect(accepted).toBeGreaterThan(20); // the generator does reach the accepted shape, not only refusals
  });

  it('turns our error shape into an ApiError with its code and details, and anything else into HTTP_<status>', () => {
    const e = toApiError(400, { error: { code: 'VALIDATION_FAILED', message: 'Check the rows.', details: [{ path: 'rows.2.unit_price', message: 'Not a price', line: 3, column: 'unit_price' }] } });
    expect(e).toBeInstanceOf(ApiError);
    expect([e.status, e.code, e.details[0]?.line]).toEqual([400, 'VALIDATION_FAILED', 3]);
    expect(toApiError(502, '<html>bad gateway</html>').code).toBe('HTTP_502');
    expect(toApiError(0, undefined).code).toBe('NETWORK_ERROR');
  });
});
