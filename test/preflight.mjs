// Checks what the test suite needs from the machine before any test runs, so a missing
// prerequisite fails loudly with its name and the command that installs it, never by skipping.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const problems = [];

function have(cmd, args) {
  try {
    execFileSync(cmd, args, { stdio: 'ignore', timeout: 30_000 });
    return true;
  } catch {
    return false;
  }
}

const [major, minor] = process.versions.node.split('.').map(Number);
if (major < 20 || (major === 20 && minor < 19)) {
  problems.push(`Node ${process.versions.node} is too old: install Node 20.19 or newer.`);
}
if (!existsSync('/usr/bin/chromium')) {
  problems.push('Chromium is missing (/usr/bin/chromium): sudo apt-get install -y chromium');
}
if (!have('ngspice', ['-v'])) {
  problems.push('ngspice is missing (the reference circuit simulator): sudo apt-get install -y ngspice');
}
if (!have('pdftotext', ['-v'])) {
  problems.push('poppler-utils is missing (pdftotext, pdftoppm): sudo apt-get install -y poppler-utils');
}
try {
  const Database = require('better-sqlite3');
  new Database(':memory:').close();
} catch (err) {
  problems.push(`better-sqlite3 does not load (${err.message.split('\n')[0]}): run npm ci (it builds the native module).`);
}

if (problems.length > 0) {
  console.error('The test suite cannot run on this machine yet:');
  for (const p of problems) console.error(`  - ${p}`);
  process.exit(1);
}
console.log('preflight: Node, Chromium, ngspice, poppler-utils and better-sqlite3 are present.');
