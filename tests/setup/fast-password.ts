import { createHash } from 'node:crypto';

/** A fast stand-in for scrypt in tests only (see AuthOptions.passwordHasher); never used by the app itself. */
export const fastPasswordHasher = {
  hash: async (password: string) => `test-sha256$${createHash('sha256').update(password).digest('hex')}`,
  verify: async ({ hash, password }: { hash: string; password: string }) =>
    hash === `test-sha256$${createHash('sha256').update(password).digest('hex')}`,
};
