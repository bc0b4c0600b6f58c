#!/usr/bin/env node
// Entry point of `npm start` and `npm test`. Plain JavaScript on purpose: it runs before dependencies
// are installed. It installs them (npm ci) when node_modules is missing or older than the lock file,
// installs Chromium for the browser tests when it is absent, then hands over to server/dev/stack.ts.
'use strict';
const { spawnSync, spawn } = require('node:child_process');
const crypto = require('node:crypto');
const fs = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '..', '..');
const [mode, ...rest] = process.argv.slice(2);
if (mode !== 'start' && mode !== 'test') {
  console.error('usage: node server/dev/bootstrap.js start|test [jest arguments...]');
  process.exit(2);
}

function run(command, args) {
  const result = spawnSync(command, args, { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error(`[trimsheet] ${command} ${args.join(' ')} failed`);
    process.exit(result.status ?? 1);
  }
}

function ensureDependencies() {
  const lockHash = crypto.createHash('sha256').update(fs.readFileSync(path.join(root, 'package-lock.json'))).digest('hex');
  const stamp = path.join(root, 'node_modules', '.trimsheet-lock-hash');
  const installed = fs.existsSync(stamp) ? fs.readFileSync(stamp, 'utf8').trim() : '';
  if (installed === lockHash) return;
  console.log('[trimsheet] installing dependencies (npm ci)...');
  run('npm', ['ci', '--no-audit', '--no-fund']);
  fs.writeFileSync(stamp, lockHash);
}

function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    console.error('[trimsheet] the browser tests need Debian Chromium: run `sudo apt-get install -y chromium`');
    process.exit(1);
  }
  console.log('[trimsheet] installing Chromium for the browser tests (apt-get)...');
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', 'chromium']);
}

/** LibreOffice Calc recalculates exported workbooks in the exchange tests, as a partner's spreadsheet program would. */
function ensureLibreOffice() {
  if (fs.existsSync('/usr/bin/soffice')) return;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    console.error('[trimsheet] the workbook tests need LibreOffice Calc: run `sudo apt-get install -y libreoffice-calc`');
    process.exit(1);
  }
  console.log('[trimsheet] installing LibreOffice Calc for the workbook tests (apt-get)...');
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', 'libreoffice-calc']);
}

ensureDependencies();
if (mode === 'test') {
  ensureChromium();
  ensureLibreOffice();
}

const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const child = spawn(tsx, [path.join(root, 'server', 'dev', 'stack.ts'), mode, ...rest], { cwd: root, stdio: 'inherit' });
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
