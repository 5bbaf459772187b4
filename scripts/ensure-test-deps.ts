// Runs before `npm test`: the browser tests need a built client and Debian's chromium. On a fresh machine,
// as root with apt-get, it installs chromium from Debian's packages; elsewhere it says what to install.
import { execSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { buildClientIfStale } from './build-client';

export const CHROMIUM_PATHS = ['/usr/bin/chromium', '/usr/bin/chromium-browser'];

function haveChromium(): boolean {
  return Boolean(process.env.CHROMIUM_PATH) || CHROMIUM_PATHS.some((p) => existsSync(p));
}

if (!haveChromium()) {
  const isRoot = process.getuid?.() === 0;
  const hasApt = existsSync('/usr/bin/apt-get');
  if (isRoot && hasApt) {
    console.log("Installing Debian's chromium for the browser tests (apt-get)...");
    execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends chromium', {
      stdio: 'inherit',
      shell: '/bin/bash',
    });
  } else {
    console.error('The browser tests need Chromium: run `sudo apt-get install chromium`, or set CHROMIUM_PATH.');
    process.exit(1);
  }
}
await buildClientIfStale();
