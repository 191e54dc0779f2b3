/**
 * Worker threads for heavy-work.ts, at a lower scheduling priority than the event loop. A
 * sign-in's Argon2id (about 25 ms of CPU on purpose) or a trace CSV's parsing would otherwise
 * compete on equal terms with every request's event loop and PostgreSQL: under load the few
 * heavy requests set the latency of all the others (bench/load.ts measured it). Niced threads
 * take the CPU the rest leaves; they still get it all when nothing else runs.
 *
 * The compiled server loads heavy-work.js; from TypeScript sources (tests, `npm run dev`) the
 * workers load heavy-work.ts through tsx. Settings: SIDECHECK_HEAVY_WORK_THREADS (default: one per core),
 * SIDECHECK_HEAVY_WORK_NICE (default 10; 0 turns it off; Linux only, elsewhere ignored).
 */
import os from 'node:os';
import path from 'node:path';
import { Piscina } from 'piscina';
import { wholeNumberSetting } from '../config/whole-number-setting';
import type { HeavyTask } from './heavy-work';

let pool: Piscina | undefined;

function createPool(): Piscina {
  const compiled = path.extname(__filename) === '.js';
  return new Piscina({
    filename: path.join(__dirname, compiled ? 'heavy-work.js' : 'heavy-work.ts'),
    ...(compiled ? {} : { execArgv: ['--require', require.resolve('tsx/cjs')] }),
    minThreads: 1,
    maxThreads: wholeNumberSetting(process.env, 'SIDECHECK_HEAVY_WORK_THREADS', os.availableParallelism(), { min: 1, max: 64 }),
    niceIncrement: wholeNumberSetting(process.env, 'SIDECHECK_HEAVY_WORK_NICE', 10, { min: 0, max: 19 }),
    idleTimeout: 60_000,
  });
}

/** Runs `task` in the pool (made on first use) and answers its result. */
export function runHeavy<T>(task: HeavyTask): Promise<T> {
  pool ??= createPool();
  return pool.run(task) as Promise<T>;
}

/** Ends the pool's threads (server shutdown, tests); the next task makes a new pool. */
export async function closeHeavyPool(): Promise<void> {
  const closing = pool;
  pool = undefined;
  await closing?.destroy();
}
