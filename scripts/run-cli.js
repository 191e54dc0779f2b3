#!/usr/bin/env node
// Runs the compiled `sidecheck` command line (dist/cli), compiling it first when dist/cli is
// missing or older than a source file it is built from. Plain CommonJS, no dependencies, so it
// starts fast: bench automation calls it as a whole process.
'use strict';
const fs = require('node:fs');
const path = require('node:path');
const { spawnSync } = require('node:child_process');

const root = path.resolve(__dirname, '..');
const outDir = path.join(root, 'dist', 'cli');
const stamp = path.join(outDir, '.build-stamp');
const lockDir = path.join(root, 'dist', '.cli-build-lock');
const entry = path.join(outDir, 'server', 'cli', 'main.js');
const LOCK_STALE_MS = 5 * 60 * 1000;

function mtimeMs(file) {
  try {
    return fs.statSync(file).mtimeMs;
  } catch {
    return undefined;
  }
}

/** .ts files under a folder (specs excluded: the build excludes them too). */
function sourcesUnder(dir, found = []) {
  let entries = [];
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return found;
  }
  for (const e of entries) {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) sourcesUnder(full, found);
    else if (/(?<!\.(spec|test|d))\.ts$/.test(e.name)) found.push(full);
  }
  return found;
}

/** The sources of every compiled file, plus the command line's own folder (new files count). */
function buildInputs() {
  const inputs = [path.join(root, 'tsconfig.json'), path.join(root, 'tsconfig.cli.json')];
  inputs.push(...sourcesUnder(path.join(root, 'server', 'cli')));
  const walk = (dir) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, e.name);
      if (e.isDirectory()) walk(full);
      else if (e.name.endsWith('.js')) {
        inputs.push(path.join(root, path.relative(outDir, full)).replace(/\.js$/, '.ts'));
      }
    }
  };
  walk(outDir);
  return inputs;
}

function isStale() {
  const built = mtimeMs(stamp);
  if (built === undefined || mtimeMs(entry) === undefined) return true;
  // A source that is gone is ignored: whatever imported it has changed too.
  return buildInputs().some((file) => {
    const changed = mtimeMs(file);
    return changed !== undefined && changed > built;
  });
}

function sleep(ms) {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

/** One build at a time: parallel test workers may all start the command line at once. */
function withBuildLock(action) {
  fs.mkdirSync(path.dirname(lockDir), { recursive: true });
  for (;;) {
    try {
      fs.mkdirSync(lockDir);
      break;
    } catch (error) {
      if (error.code !== 'EEXIST') throw error;
      const since = mtimeMs(lockDir);
      const stale = since !== undefined && Date.now() - since > LOCK_STALE_MS;
      if (stale) fs.rmSync(lockDir, { recursive: true, force: true });
      else sleep(200);
    }
  }
  try {
    return action();
  } finally {
    fs.rmSync(lockDir, { recursive: true, force: true });
  }
}

function build() {
  process.stderr.write('building the command line...\n');
  // Stamp with the start time, so a source saved during the build still counts as newer.
  const startedAt = new Date();
  // Compiled over the old output rather than after deleting it: another process may be loading
  // the command line at this moment.
  const tsc = path.join(root, 'node_modules', 'typescript', 'bin', 'tsc');
  const result = spawnSync(process.execPath, [tsc, '-p', path.join(root, 'tsconfig.cli.json')], {
    cwd: root,
    encoding: 'utf8',
  });
  if (result.status !== 0) {
    process.stderr.write(result.stdout + result.stderr);
    process.stderr.write('sidecheck: the command line failed to compile (see the errors above)\n');
    process.exit(1);
  }
  fs.writeFileSync(stamp, startedAt.toISOString() + '\n');
  fs.utimesSync(stamp, startedAt, startedAt);
}

if (isStale()) withBuildLock(() => (isStale() ? build() : undefined));
require(entry).runFromProcess(process.argv.slice(2));
