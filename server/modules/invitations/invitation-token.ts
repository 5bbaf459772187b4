import { createHash, randomBytes } from 'node:crypto';

/** Days an invitation link stays valid. */
export const INVITATION_TTL_DAYS = 7;

/** A random token for the link (256 bits, URL-safe); only its SHA-256 is stored. */
export function newInvitationToken(now = new Date()) {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token), expiresAt: new Date(now.getTime() + INVITATION_TTL_DAYS * 86_400_000) };
}

export const hashToken = (token: string) => createHash('sha256').update(token, 'utf8').digest('hex');

export const TOKEN_SHAPE = /^[A-Za-z0-9_-]{20,100}$/;
