import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 128;

const LIST_FILE = path.join(path.dirname(fileURLToPath(import.meta.url)), 'common-passwords.txt');
let common: Set<string> | undefined;

/** The shipped list of common passwords (lower-cased), read once on first use. */
function commonPasswords(): Set<string> {
  common ??= new Set(
    readFileSync(LIST_FILE, 'utf8')
      .split('\n')
      .map((l) => l.trim())
      .filter((l) => l && !l.startsWith('#')),
  );
  return common;
}

/**
 * Why a new password is refused, or null when it may be used. Checked on sign-up, reset and change
 * (OWASP ASVS 4.0.3 2.1.1: at least 12 characters; 2.1.7: checked against a list of breached passwords).
 */
export function passwordProblem(password: string): string | null {
  if (password.length < MIN_PASSWORD_LENGTH) {
    return `The password must be at least ${MIN_PASSWORD_LENGTH} characters long.`;
  }
  if (password.length > MAX_PASSWORD_LENGTH) {
    return `The password must be at most ${MAX_PASSWORD_LENGTH} characters long.`;
  }
  const lowered = password.toLowerCase();
  if (commonPasswords().has(lowered) || /^(.)\1+$/u.test(password)) {
    return 'This password is on a list of common passwords that attackers try first. Choose another one.';
  }
  return null;
}
