/**
 * The heavy-work pool: Argon2id and trace reading give the same answers from a worker thread as
 * they would inline, an importer's complaint still becomes the 422 naming line and column, and
 * the worker threads run at the lower priority (Linux: the nice value of each thread in
 * /proc/self/task/<tid>/stat, field 19, proc(5)).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { verify } from '@node-rs/argon2';
import { hashPassword, verifyPassword } from '../auth/password';
import { analyseTraceFile } from '../analysis/analyse-trace-file';
import { ImportProblem } from '../uploads/upload-problems';
import { closeHeavyPool, runHeavy } from './heavy-pool';

afterAll(() => closeHeavyPool());

const niceOfThreads = () =>
  fs.readdirSync('/proc/self/task').map((tid) => Number(fs.readFileSync(`/proc/self/task/${tid}/stat`, 'utf8').split(') ')[1].split(' ')[16]));

describe('the heavy-work pool', () => {
  it('hashes with Argon2id (RFC 9106) as a PHC string with OWASP’s minimum parameters, and verifies, in a worker', async () => {
    const hash = await hashPassword('correct horse 42');
    expect(hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    // Checked by the library on this thread as well: the worker's hash is an ordinary one.
    expect(await verify(hash, 'correct horse 42')).toBe(true);
    expect(await verifyPassword(hash, 'correct horse 42')).toBe(true);
    expect(await verifyPassword(hash, 'correct horse 43')).toBe(false);
    expect(await verifyPassword('$argon2id$not-a-hash', 'x')).toBe(false);
    expect(await verifyPassword(null, 'x')).toBe(false);
  });

  it('reads a trace in a worker, and a bad field is still the 422 with its line and column', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'heavy-pool-'));
    try {
      const good = path.join(dir, 'good.csv');
      fs.writeFileSync(good, '# RBW: 300 Hz\nfrequency_hz,level_dbm\n2181000,-60\n2182000,-10.5\n2183000,-61\n');
      const { evidence, summary } = await analyseTraceFile(good, { carrierHz: 2_182_000, sideband: 'usb' });
      expect(Array.from(evidence.frequencyHz)).toEqual([2_181_000, 2_182_000, 2_183_000]);
      expect(Object.prototype.toString.call(evidence.levelDbm)).toBe('[object Float64Array]'); // from another realm under jest
      expect(summary).toMatchObject({ pointCount: 3, rbwHz: 300, peak: { frequencyHz: 2_182_000, levelDbm: -10.5 } });

      const bad = path.join(dir, 'bad.csv');
      fs.writeFileSync(bad, 'frequency_hz,level_dbm\n2181000,-60\n2182000,-1O\n');
      const refused = analyseTraceFile(bad, { carrierHz: 2_182_000, sideband: 'usb' });
      await expect(refused).rejects.toBeInstanceOf(ImportProblem);
      await expect(refused).rejects.toMatchObject({ status: 422, location: { part: 'file', line: 3, column: 2 } });
      await expect(refused).rejects.toThrow(/parseTraceCsv: line 3, column 2: level "-1O" is not a number/);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  (process.platform === 'linux' ? it : it.skip)('runs its threads at nice 10 while this thread stays at its own priority', async () => {
    await runHeavy({ kind: 'verify-password', hash: '$argon2id$not-a-hash', password: 'x' });
    const nice = niceOfThreads();
    expect(nice).toContain(10);
    expect(Math.min(...nice)).toBe(os.getPriority()); // the main thread (and libuv's) unchanged
  });
});
