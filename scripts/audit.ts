/**
 * `npm audit` at high severity for CI. Fails on a high or critical advisory that has a fix (update it); reports
 * without failing one that has no fix yet (nothing to update to: it is listed for a person to weigh), and reports
 * without failing when the registry's audit service cannot be reached (some mirrors do not offer it).
 */
import { spawnSync } from 'node:child_process';

type Vuln = { name: string; severity: string; fixAvailable: boolean | object; via: unknown[] };
// A closed network makes npm retry for minutes: one try, a short fetch timeout, and a hard stop at 90 s.
const run = spawnSync('npm', ['audit', '--json', '--audit-level=high', '--fetch-retries=0', '--fetch-timeout=20000'], {
  encoding: 'utf8',
  timeout: 90_000,
});
let report: { vulnerabilities?: Record<string, Vuln>; error?: { summary?: string } };
try {
  report = run.error ? { error: { summary: run.error.message } } : JSON.parse(run.stdout || '{}');
} catch {
  report = { error: { summary: run.stderr.trim() || 'unreadable output' } };
}
if (report.error || !report.vulnerabilities) {
  console.log(
    `== npm audit: the audit service could not be reached (${report.error?.summary ?? run.stderr.trim()}); skipped`,
  );
  process.exit(0);
}
const serious = Object.values(report.vulnerabilities).filter((v) => v.severity === 'high' || v.severity === 'critical');
const fixable = serious.filter((v) => v.fixAvailable !== false);
for (const v of serious) {
  console.log(
    `  ${v.severity}: ${v.name}${v.fixAvailable === false ? ' (no fix available yet: reported only)' : ' (fix available)'}`,
  );
}
if (fixable.length > 0) {
  console.error(
    `== npm audit: ${fixable.length} high or critical advisories with a fix; run npm audit fix or update them`,
  );
  process.exit(1);
}
console.log(`== npm audit: no high or critical advisory with a fix (${serious.length} without a fix reported)`);
