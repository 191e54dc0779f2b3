import fs from 'node:fs';
import path from 'node:path';
import { errorLines, PROJECT_ROOT, runCompiledCli } from './cli-process.test-support';

describe('sidecheck command line (compiled)', () => {
  beforeAll(() => {
    expect(runCompiledCli(['--help']).status).toBe(0);
  }, 180_000);

  it('prints usage for --help and exits 0', () => {
    const run = runCompiledCli(['--help']);
    expect(run.status).toBe(0);
    for (const command of ['analyze-iq', 'analyze-trace', 'synthesize', 'self-validate']) {
      expect(run.stdout).toContain(`sidecheck ${command}`);
    }
    expect(runCompiledCli(['analyze-iq', '--help']).stdout).toMatch(/^Usage: sidecheck analyze-iq/);
  });

  it('exits 2 with one stderr line for an unknown command or option', () => {
    const unknown = runCompiledCli(['analyse-iq']);
    expect(unknown.status).toBe(2);
    const expected = 'sidecheck: unknown command "analyse-iq" (see sidecheck --help)';
    expect(errorLines(unknown)).toEqual([expected]);
    const option = runCompiledCli(['analyze-iq', 'x.sigmf-meta', '--sidebnd', 'usb']);
    expect(option.status).toBe(2);
    const message = 'sidecheck: analyze-iq: unknown option --sidebnd (see --help)';
    expect(errorLines(option)).toEqual([message]);
  });

  it('prints usage on stderr with exit 2 when called bare', () => {
    const bare = runCompiledCli([]);
    expect(bare.status).toBe(2);
    expect(bare.stdout).toBe('');
    expect(bare.stderr).toContain('Usage:');
  });

  it('rebuilds when a compiled source is newer than the build', () => {
    const stamp = path.join(PROJECT_ROOT, 'dist', 'cli', '.build-stamp');
    // Older than any source, however long ago the checkout was made (an hour ago was not enough
    // in a working copy whose sources had not changed for longer).
    const old = new Date('2000-01-01T00:00:00Z');
    fs.utimesSync(stamp, old, old);
    const run = runCompiledCli(['--help']);
    expect(run.status).toBe(0);
    expect(run.stderr).toContain('building the command line...');
    expect(runCompiledCli(['--help']).stderr).toBe('');
  }, 180_000);
});
