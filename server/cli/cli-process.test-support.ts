// Test support for the command-line specs: runs the real compiled CLI (scripts/run-cli.js) as a
// child process, the way bench automation does.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export const PROJECT_ROOT = path.resolve(__dirname, '..', '..');

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** Runs `node scripts/run-cli.js ...args` to completion. */
export function runCompiledCli(args: string[], timeoutMs = 120_000): CliRun {
  const script = path.join(PROJECT_ROOT, 'scripts', 'run-cli.js');
  const result = spawnSync(process.execPath, [script, ...args], {
    cwd: PROJECT_ROOT,
    encoding: 'utf8',
    timeout: timeoutMs,
    maxBuffer: 1 << 24,
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** The stderr of a failed run without the one-time build notice. */
export function errorLines(run: CliRun): string[] {
  const notice = 'building the command line...';
  return run.stderr.split('\n').filter((line) => line !== '' && line !== notice);
}

/** A fresh temp folder for one spec file, removed by the returned cleanup. */
export function makeTempFolder(label: string): { folder: string; remove: () => void } {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), `sidecheck-${label}-`));
  return { folder, remove: () => fs.rmSync(folder, { recursive: true, force: true }) };
}
