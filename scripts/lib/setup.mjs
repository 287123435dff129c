// Install steps shared by `npm start` and `npm test`: whatever a fresh machine is missing.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { aptInstall } from './postgres.mjs';

export function ensureNodeModules(root, log = console.log) {
  if (existsSync(`${root}/node_modules/.package-lock.json`)) return;
  const lock = existsSync(`${root}/package-lock.json`);
  log(`node_modules is missing: running npm ${lock ? 'ci' : 'install'}…`);
  const r = spawnSync('npm', [lock ? 'ci' : 'install', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('npm install failed; see the output above.');
}

/** Debian's Chromium for the browser tests (no browser download from anywhere else). */
export function ensureChromium(log = console.log) {
  if (existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  log('Chromium not found: installing Debian package "chromium" for the browser tests…');
  aptInstall(['chromium'], log);
  return '/usr/bin/chromium';
}

/** pdftotext and pdftoppm, to read generated PDFs back in tests. */
export function ensurePoppler(log = console.log) {
  if (existsSync('/usr/bin/pdftotext') && existsSync('/usr/bin/pdftoppm')) return;
  log('poppler-utils not found: installing it to check generated PDFs…');
  aptInstall(['poppler-utils'], log);
}
