import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ACCESS_ROLES, CHANGE_ORDER_STATUSES, PAY_APP_STATUSES, TALLY_STATUSES } from '../../src/shared/constants';

/**
 * Issue 12, item 8: who may do what is decided once, by the shared policies (src/shared/policies), and presenters
 * send it as `can: { ... }`. A screen that compares a role name, reads `myRoles`, or compares a workflow status
 * (tally, pay application, change order) with a string literal re-derives a permission or a transition; this test
 * fails on such a line under src/features or src/app.
 *
 * PENDING lists the files of modules whose `can` has not landed yet, with the slice that removes them; an entry
 * whose file no longer has such a line fails too, so the list only shrinks.
 */
const PENDING: Record<string, string> = {};

const walk = (dir: string): string[] =>
  readdirSync(dir).flatMap((name) => {
    const p = path.join(dir, name);
    return statSync(p).isDirectory() ? walk(p) : /\.tsx?$/.test(name) ? [p.split(path.sep).join('/')] : [];
  });

const alt = (words: readonly string[]) => [...new Set(words)].join('|');
const ROLE = alt(ACCESS_ROLES);
const STATUS = alt([...TALLY_STATUSES, ...PAY_APP_STATUSES, ...CHANGE_ORDER_STATUSES]);
const CHECKS: RegExp[] = [
  new RegExp(`(?:===|!==)\\s*'(?:${ROLE})'`),
  new RegExp(`'(?:${ROLE})'\\s*(?:===|!==)`),
  /\b(?:myRoles|roles)\.(?:includes|some|every|find|indexOf)\(/,
  new RegExp(`\\.status\\s*(?:===|!==)\\s*'(?:${STATUS})'`),
  new RegExp(`'(?:${STATUS})'\\s*(?:===|!==)\\s*[\\w?.]*\\.status\\b`),
  new RegExp(`\\[[^\\]]*'(?:${STATUS})'[^\\]]*\\]\\.includes\\(`),
];

function offences(file: string): string[] {
  return readFileSync(file, 'utf8')
    .split('\n')
    .flatMap((line, i) => (CHECKS.some((c) => c.test(line)) ? [`${file}:${i + 1}: ${line.trim()}`] : []));
}

const FILES = [...walk('src/features'), ...walk('src/app')];

describe('screens read `can`, never roles or workflow statuses', () => {
  it('the checks catch the shapes they are meant to', () => {
    const hit = (line: string) => CHECKS.some((c) => c.test(line));
    expect(hit("project.myRoles.includes('subcontractor')")).toBe(true);
    expect(hit("if (role === 'owner_admin') x();")).toBe(true);
    expect(hit("const draft = tally.status === 'draft';")).toBe(true);
    expect(hit("['returned', 'draft'].includes(status)")).toBe(true);
    expect(hit('{tally.can.edit ? <Edit /> : null}')).toBe(false);
    expect(hit("r.status === 'over'")).toBe(false);
  });

  it('no component outside the pending modules compares a role or a status', () => {
    const found = FILES.filter((f) => !(f in PENDING)).flatMap(offences);
    expect(found).toEqual([]);
  });

  it('every pending file still has such a line (otherwise take it off the list)', () => {
    const done = Object.keys(PENDING).filter((f) => !FILES.includes(f) || offences(f).length === 0);
    expect(done).toEqual([]);
  });
});
