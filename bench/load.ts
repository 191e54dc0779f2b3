/**
 * Benchmark: a mixed workload against the production build of Sidecheck, two API processes on one
 * database of 10 invented labs x 10,000 runs (bench/seed-volume.ts). Prints throughput and
 * p50/p99 latency per kind of request and overall, the non-2xx answers and errors, beside the
 * targets (no pass/fail on figures); exits non-zero when any request failed.
 *
 *   npm run bench:load                 (60 s phases)
 *   npm run bench:load -- --quick      (10 s phases)
 *   node node_modules/tsx/dist/cli.mjs bench/load.ts [--quick] [--duration 60] [--rate 300]
 *        [--connections 16] [--instances 10] [--reuse] [--keep-db] [--per-kind] [--kinds list,save]
 *        [--weights upload=0,sign-in=0] [--rate-only] [--timeline]
 *
 * Works from a fresh clone after `npm run build` (or without it: when dist/server is missing the
 * server is compiled with tsc; the client is not needed, the API serves only /api here). Uses
 * DATABASE_URL when set (a migrated or empty scratch database: the volume is added to it);
 * otherwise a fresh private cluster (scripts/pg-cluster.sh) in LOAD_PG_DIR (default
 * .data/pg-bench-load) on LOAD_PG_PORT (default 54640), destroyed first (`--reuse` keeps one that
 * exists, with its volume) and stopped at the end (`--keep-db` leaves it running for EXPLAIN).
 * Processes listen on 127.0.0.1 from LOAD_BASE_PORT (default 4640): API 1 and 2, mail stand-in
 * SMTP and inbox, payments stand-in, and two bare endpoints (+0 ... +6). Nothing leaves 127.0.0.1.
 *
 * The phases, in order:
 *  1. bare: a tiny Express + pg server (this file with --bare-server, two processes like the
 *     API) answering a primary-key SELECT of one test run: the ceiling of this machine's
 *     HTTP + PostgreSQL round trip, closed loop.
 *  2. capacity: the mix, closed loop (each connection sends the next request when the last is
 *     answered) with --connections per API process: the most this machine sustains.
 *  3. at the target rate: the same mix at --rate requests/s in total, then at half the capacity
 *     measured in 2 (the latency of a machine that is not saturated). autocannon limits a rate per
 *     connection by sending that connection's quota for a second back to back when the second
 *     begins, then waiting; --instances autocannon instances (default 10: 8 connections each at
 *     the target rate, 4 at half) have their seconds staggered evenly, so every 100 ms a group of
 *     requests arrives together. --instances 60 spreads the same rate over 60 instances of two
 *     connections, closer to a steady stream (README: with the heavy work in niced worker threads
 *     it halves the p99 at 300 req/s; before, it lowered only the median).
 *  4. scale: sequential run-list requests in labs of 100, 1,000 and 10,000 runs.
 *  (--per-kind: before 2, each kind alone, closed loop, with the server CPU it costs per request.
 *   --kinds list,save: only those kinds alone, then stop; for profiling, LOAD_API_NODE_ARGS adds
 *   Node options to the API processes, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof".
 *   --rate-only: only phase 3, then stop; to compare settings at the target rate. --timeline: phase 3
 *   also prints the p99 of lists and saves for each 5 s, to tell a steady tail from bursts.)
 * The mix, by count of requests: run lists with filters, sorts and pages 45 %, reading saves on
 * runs on the bench 25 %, run workspace (GET /runs/:id) 12 %, report PDF downloads 10 %, trace
 * CSV uploads 5 %, sign-ins 3 %. Requests alternate between the two API processes by instance
 * (one autocannon per process): no load balancer in between.
 *
 * Each phase also prints the CPU time the API processes and PostgreSQL spent per request (from
 * /proc; PostgreSQL's only for the private cluster), which depends far less than throughput on
 * what else the machine is doing. autocannon runs in this process and shares the machine's cores
 * with the servers and PostgreSQL, so throughput figures are a floor for the server alone.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { asSystem } from '../server/tenancy/tenant-transaction';
import { demoMaskTrace } from '../server/demo/demo-mask-trace';
import { seedVolume, volumeLabs, VOLUME_PASSWORD } from './seed-volume';

const ROOT = path.resolve(__dirname, '..');
const TARGETS = { sustainedRps: 300, listP99Ms: 100, saveP99Ms: 100, errors: 0, bareFraction: 0.5 };
const MIX = [
  { kind: 'list', weight: 45 },
  { kind: 'save', weight: 25 },
  { kind: 'workspace', weight: 12 },
  { kind: 'pdf', weight: 10 },
  { kind: 'upload', weight: 5 },
  { kind: 'sign-in', weight: 3 },
] as const;
type Kind = (typeof MIX)[number]['kind'] | 'bare';

// ---------------------------------------------------------------------------------------------
// autocannon (no type declarations ship with it): the part used here.
interface AcRequest { method?: string; path?: string; headers?: Record<string, string>; body?: string | Buffer }
interface AcOptions {
  url: string;
  connections: number;
  duration: number;
  overallRate?: number;
  timeout?: number;
  requests: { setupRequest: (req: AcRequest, context: Record<string, unknown>) => AcRequest; onResponse?: (status: number, body: string, context: Record<string, unknown>) => void }[];
}
interface AcResult { errors: number; timeouts: number; non2xx: number; requests: { total: number } }
interface AcInstance {
  on(event: 'response', fn: (client: { requestIterator: { context: Record<string, unknown> } }, status: number, bytes: number, ms: number) => void): void;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (options: AcOptions, done: (error: Error | null, result: AcResult) => void) => AcInstance;

// ---------------------------------------------------------------------------------------------
interface Args { quick: boolean; durationS: number; rate: number; connections: number; instances: number; reuse: boolean; keepDb: boolean; perKind: boolean; kinds: string[] | null; weights: Record<string, number>; rateOnly: boolean; timeline: boolean }

function readArgs(argv: string[]): Args {
  const value = (name: string) => {
    const i = argv.indexOf(name);
    return i >= 0 ? Number(argv[i + 1]) : undefined;
  };
  const quick = argv.includes('--quick');
  return {
    quick,
    durationS: value('--duration') ?? (quick ? 10 : 60),
    rate: value('--rate') ?? TARGETS.sustainedRps,
    connections: value('--connections') ?? 16,
    instances: value('--instances') ?? 10,
    reuse: argv.includes('--reuse'),
    keepDb: argv.includes('--keep-db'),
    perKind: argv.includes('--per-kind') || argv.includes('--kinds'),
    kinds: argv.includes('--kinds') ? argv[argv.indexOf('--kinds') + 1].split(',') : null,
    weights: readWeights(argv),
    rateOnly: argv.includes('--rate-only'),
    timeline: argv.includes('--timeline'),
  };
}

/** The mix's weights, unless `--weights upload=0,sign-in=0` changes some (to tell apart what each kind does to the others). */
function readWeights(argv: string[]): Record<string, number> {
  const weights: Record<string, number> = Object.fromEntries(MIX.map((m) => [m.kind, m.weight]));
  const i = argv.indexOf('--weights');
  if (i < 0) return weights;
  for (const pair of (argv[i + 1] ?? '').split(',')) {
    const [kind, weight] = pair.split('=');
    if (!(kind in weights) || !(Number(weight) >= 0)) throw new Error(`--weights: "${pair}" is not kind=weight for a kind of the mix`);
    weights[kind] = Number(weight);
  }
  return weights;
}

const log = (line: string) => console.log(line);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function runChecked(command: string, args: string[], env: NodeJS.ProcessEnv = process.env): string {
  const out = spawnSync(command, args, { cwd: ROOT, env, encoding: 'utf8' });
  if (out.status !== 0) throw new Error(`${command} ${args.join(' ')} failed (${out.status}):\n${out.stdout}\n${out.stderr}`);
  return out.stdout.trim();
}

function ensureServerBuild(): void {
  if (fs.existsSync(path.join(ROOT, 'dist/server/server/main.js')) && fs.existsSync(path.join(ROOT, 'dist/server/fakes/main.js'))) return;
  log('dist/server is missing: compiling the server with tsc (about 20 s)...');
  runChecked(process.execPath, [path.join(ROOT, 'node_modules/typescript/bin/tsc'), '-p', 'tsconfig.server.json']);
}

/** The database: DATABASE_URL, or a fresh private cluster of our own. */
function prepareDatabase(args: Args): { url: string; stop: () => void; postmasterPidFile: string | null } {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, stop: () => undefined, postmasterPidFile: null };
  const env = {
    ...process.env,
    PG_DIR: process.env.LOAD_PG_DIR ?? path.join(ROOT, '.data/pg-bench-load'),
    PG_PORT: process.env.LOAD_PG_PORT ?? '54640',
    PG_DB: 'sidecheck_load',
  };
  const cluster = (command: string) => runChecked('bash', [path.join(ROOT, 'scripts/pg-cluster.sh'), command], env);
  if (!args.reuse) cluster('destroy');
  cluster('start');
  return { url: cluster('url'), postmasterPidFile: path.join(env.PG_DIR, 'data', 'postmaster.pid'), stop: () => (args.keepDb ? log(`database left running: ${env.PG_DIR} on port ${env.PG_PORT}`) : cluster('stop')) };
}

// ---------------------------------------------------------------------------------------------
interface Started { name: string; child: ChildProcess; output: () => string }

function startNode(name: string, args: string[], env: NodeJS.ProcessEnv): Started {
  const child = spawn(process.execPath, args, { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  const keep = (d: Buffer) => {
    out += d.toString();
    if (out.length > 20_000) out = out.slice(-10_000);
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  return { name, child, output: () => out };
}

async function waitForHttp(url: string, started: Started, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    if (started.child.exitCode !== null) throw new Error(`${started.name} exited early:\n${started.output()}`);
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${url}\n${started.output()}`);
    await sleep(250);
  }
}

async function stopAll(processes: Started[]): Promise<void> {
  await Promise.all(processes.map((p) => new Promise<void>((resolve) => {
    if (p.child.exitCode !== null || p.child.signalCode !== null) return resolve();
    p.child.once('exit', () => resolve());
    p.child.kill('SIGTERM');
    setTimeout(() => p.child.kill('SIGKILL'), 5000).unref();
  })));
}

// ---------------------------------------------------------------------------------------------
/** What the workload picks from: per lab, its people, runs on the bench with their cases, reports. */
interface LabFixture {
  code: string;
  orgId: string;
  runs: number;
  engineers: string[];
  everyone: string[];
  tokens: string[];
  bench: { runId: string; carrierCases: string[]; maskCase: string }[];
  reports: string[];
  engineerIds: string[];
}

async function loadFixtures(sequelize: Sequelize, labs: { code: string; runs: number }[]): Promise<LabFixture[]> {
  return asSystem(sequelize, async (transaction) => {
    const out: LabFixture[] = [];
    for (const lab of labs) {
      const q = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
      const [org] = await q<{ id: string }>('SELECT id FROM organizations WHERE code = :code', { code: lab.code });
      const people = await q<{ email: string; role: string; id: string }>(
        'SELECT u.email, m.role, u.id FROM memberships m JOIN users u ON u.id = m.user_id WHERE m.organization_id = :org ORDER BY u.email',
        { org: org.id },
      );
      const bench = await q<{ run_id: string; cases: { id: string; position: number }[] }>(
        `SELECT r.id AS run_id, json_agg(json_build_object('id', c.id, 'position', c.position)) AS cases
           FROM test_runs r JOIN test_cases c ON c.organization_id = r.organization_id AND c.plan_id = r.plan_id
          WHERE r.organization_id = :org AND r.state = 'testing' GROUP BY r.id ORDER BY r.id LIMIT 1000`,
        { org: org.id },
      );
      const reports = await q<{ id: string }>('SELECT id FROM reports WHERE organization_id = :org ORDER BY id LIMIT 1000', { org: org.id });
      out.push({
        code: lab.code,
        orgId: org.id,
        runs: lab.runs,
        engineers: people.filter((p) => p.role === 'engineer').map((p) => p.email),
        engineerIds: people.filter((p) => p.role === 'engineer').map((p) => p.id),
        everyone: people.map((p) => p.email),
        tokens: [],
        bench: bench.map((b) => ({
          runId: b.run_id,
          carrierCases: b.cases.filter((c) => c.position <= 2).map((c) => c.id),
          maskCase: b.cases.find((c) => c.position === 4)!.id,
        })),
        reports: reports.map((r) => r.id),
      });
    }
    return out;
  });
}

async function signIn(port: number, email: string): Promise<string> {
  const res = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: VOLUME_PASSWORD }) });
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

// ---------------------------------------------------------------------------------------------
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(Math.random() * xs.length)];

function multipartTrace(): { body: Buffer; contentType: string } {
  const trace = demoMaskTrace();
  const boundary = '----sidecheck-load-bench-boundary';
  const body = Buffer.concat([
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="referenceDbm"\r\n\r\n${trace.referenceDbm.toFixed(2)}\r\n`),
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="two-tone mask 2182 kHz.csv"\r\nContent-Type: text/csv\r\n\r\n`),
    Buffer.from(trace.csv),
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  return { body, contentType: `multipart/form-data; boundary=${boundary}` };
}

/** One request of the given kind, for a random lab, person, run or report. */
function requestFactory(labs: LabFixture[]) {
  const big = labs.filter((l) => l.runs >= 10_000);
  const upload = multipartTrace();
  const saveBody = JSON.stringify({ values: { pepDbm: 51.7, carrierDbm: 5.9 } });
  const everyone = big.flatMap((l) => l.everyone);
  const states = ['testing', 'in-review', 'approved', 'issued', 'testing,in-review', 'draft'];
  const sorts = ['-updatedAt', 'number', '-number', 'client', 'model', 'createdAt', 'state'];
  const auth = (lab: LabFixture) => ({ authorization: `Bearer ${pick(lab.tokens)}`, 'x-organization-id': lab.orgId });
  return (kind: Kind): AcRequest => {
    const lab = pick(big);
    switch (kind) {
      case 'list': {
        const params = new URLSearchParams();
        const variant = Math.random();
        if (variant < 0.3) {
          // the runs screen as it opens: newest first, first page
        } else if (variant < 0.55) {
          params.set('state', pick(states));
          params.set('sort', pick(sorts));
        } else if (variant < 0.75) {
          params.set('sort', pick(sorts));
          params.set('page', String(1 + Math.floor(Math.random() * 40)));
        } else if (variant < 0.9) {
          params.set('search', pick(['HX-150', 'RUN-0042', 'Skerrow', 'SN-0003', 'Dunlin Radio']));
        } else {
          params.set('engineerId', pick(lab.engineerIds));
          params.set('state', 'testing');
          params.set('pageSize', '50');
        }
        const query = params.toString();
        return { method: 'GET', path: `/api/runs${query ? `?${query}` : ''}`, headers: auth(lab) };
      }
      case 'save': {
        const run = pick(lab.bench);
        return { method: 'PUT', path: `/api/runs/${run.runId}/cases/${pick(run.carrierCases)}/reading`, headers: { ...auth(lab), 'content-type': 'application/json' }, body: saveBody };
      }
      case 'workspace':
        return { method: 'GET', path: `/api/runs/${pick(lab.bench).runId}`, headers: auth(lab) };
      case 'pdf':
        return { method: 'GET', path: `/api/reports/${pick(lab.reports)}/pdf`, headers: auth(lab) };
      case 'upload': {
        const run = pick(lab.bench);
        return { method: 'POST', path: `/api/runs/${run.runId}/cases/${run.maskCase}/uploads`, headers: { ...auth(lab), 'content-type': upload.contentType }, body: upload.body };
      }
      case 'sign-in':
        return { method: 'POST', path: '/api/auth/sign-in', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: pick(everyone), password: VOLUME_PASSWORD }) };
      default:
        throw new Error(`no request for ${kind}`);
    }
  };
}

/** A kind drawn at random by the mix's weights. */
function weightedKind(weights: Record<string, number>): Kind {
  const total = MIX.reduce((s, m) => s + weights[m.kind], 0);
  let x = Math.random() * total;
  for (const m of MIX) {
    x -= weights[m.kind];
    if (x < 0) return m.kind;
  }
  return MIX[0].kind;
}

// ---------------------------------------------------------------------------------------------
/** Latencies and outcomes per kind, gathered from autocannon's response events. */
class Tally {
  latencies = new Map<Kind, number[]>();
  failures = new Map<Kind, Map<string, number>>();
  samples = new Map<Kind, string[]>();
  socketErrors = 0;
  timeouts = 0;
  seconds = 0;
  cpu: { apiMsPerRequest: number; eventLoopMsPerRequest: number; pgMsPerRequest: number; loadGeneratorCores: number } | null = null;
  /** When each run list and save was answered (ms since the phase began) with its latency, for --timeline. */
  timeline: { atMs: number; ms: number }[] = [];
  private readonly startedAt = performance.now();

  record(kind: Kind, status: number, ms: number): void {
    if (!this.latencies.has(kind)) this.latencies.set(kind, []);
    this.latencies.get(kind)!.push(ms);
    if (kind === 'list' || kind === 'save') this.timeline.push({ atMs: performance.now() - this.startedAt, ms });
    if (status < 200 || status > 299) {
      const byStatus = this.failures.get(kind) ?? new Map<string, number>();
      byStatus.set(String(status), (byStatus.get(String(status)) ?? 0) + 1);
      this.failures.set(kind, byStatus);
    }
  }

  sample(kind: Kind, status: number, body: string): void {
    if (status >= 200 && status <= 299) return;
    const list = this.samples.get(kind) ?? [];
    if (list.length < 3) list.push(`${status} ${body.slice(0, 300)}`);
    this.samples.set(kind, list);
  }

  count(kind?: Kind): number {
    return kind ? (this.latencies.get(kind)?.length ?? 0) : [...this.latencies.values()].reduce((s, l) => s + l.length, 0);
  }

  failed(kind?: Kind): number {
    const kinds = kind ? [kind] : [...this.failures.keys()];
    return kinds.reduce((s, k) => s + [...(this.failures.get(k)?.values() ?? [])].reduce((a, b) => a + b, 0), 0);
  }

  /** The p99 of lists and saves in each `windowS`-second window: whether a tail is spread or comes in bursts. */
  windows(windowS: number): { fromS: number; count: number; p99: number; max: number }[] {
    const byWindow = new Map<number, number[]>();
    for (const { atMs, ms } of this.timeline) {
      const w = Math.floor(atMs / 1000 / windowS);
      const list = byWindow.get(w);
      if (list) list.push(ms);
      else byWindow.set(w, [ms]);
    }
    return [...byWindow].sort((a, b) => a[0] - b[0]).map(([w, list]) => {
      const sorted = list.sort((a, b) => a - b);
      return { fromS: w * windowS, count: sorted.length, p99: sorted[Math.min(sorted.length - 1, Math.ceil(0.99 * sorted.length) - 1)], max: sorted[sorted.length - 1] };
    });
  }

  /** Requests that failed: non-2xx answers, socket errors and timeouts. */
  problems(): number {
    return this.failed() + this.socketErrors + this.timeouts;
  }

  percentile(p: number, kind?: Kind): number {
    const all = (kind ? (this.latencies.get(kind) ?? []) : [...this.latencies.values()].flat()).slice().sort((a, b) => a - b);
    if (!all.length) return NaN;
    return all[Math.min(all.length - 1, Math.ceil((p / 100) * all.length) - 1)];
  }
}

/** Run autocannon instances together; each request's kind comes from `choose`. */
async function drive(options: { ports: number[]; instancesPerPort: number; connections: number; durationS: number; overallRate?: number; choose: () => Kind; build: (kind: Kind) => AcRequest }): Promise<Tally> {
  const tally = new Tally();
  const runs: Promise<void>[] = [];
  const total = options.ports.length * options.instancesPerPort;
  let n = 0;
  for (let i = 0; i < options.instancesPerPort; i++) {
    for (const port of options.ports) {
      const delayMs = options.overallRate ? Math.round((n * 1000) / total) : 0;
      // The rate split over the instances, the remainder one each to the first ones (180 over 60 is 3 each, 160 is 3 or 2).
      const rate = options.overallRate && Math.max(1, Math.floor(options.overallRate / total) + (n < options.overallRate % total ? 1 : 0));
      n++;
      runs.push(sleep(delayMs).then(() => new Promise<void>((resolve, reject) => {
        const instance = autocannon(
          {
            url: `http://127.0.0.1:${port}`,
            connections: options.connections,
            duration: options.durationS,
            overallRate: rate,
            timeout: 10,
            requests: [{
              setupRequest: (req, context) => {
                const kind = options.choose();
                context.kind = kind;
                return { ...req, ...options.build(kind) };
              },
              onResponse: (status, body, context) => tally.sample(context.kind as Kind, status, body),
            }],
          },
          (error, result) => {
            if (error) return reject(error);
            tally.socketErrors += result.errors;
            tally.timeouts += result.timeouts;
            resolve();
          },
        );
        instance.on('response', (client, status, _bytes, ms) => tally.record(client.requestIterator.context.kind as Kind, status, ms));
      })));
    }
  }
  const started = performance.now();
  await Promise.all(runs);
  tally.seconds = Math.max(options.durationS, (performance.now() - started) / 1000 - (options.overallRate ? 1 : 0));
  return tally;
}

// ---------------------------------------------------------------------------------------------
/**
 * CPU time (user + system, ms) of processes, from /proc (Linux); `children` adds that of their
 * reaped children; `mainThread` counts only each process's main thread (the event loop), not its
 * worker threads (server/workers/heavy-pool.ts) or libuv's.
 */
function cpuMs(pids: number[], children = false, mainThread = false): number {
  const clockTicksPerSecond = 100; // USER_HZ on Linux
  let ticks = 0;
  for (const pid of pids) {
    try {
      const fields = fs.readFileSync(mainThread ? `/proc/${pid}/task/${pid}/stat` : `/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
      ticks += Number(fields[11]) + Number(fields[12]); // utime, stime (fields 14 and 15 of stat)
      if (children) ticks += Number(fields[13]) + Number(fields[14]); // cutime, cstime
    } catch {
      // the process has gone
    }
  }
  return (ticks * 1000) / clockTicksPerSecond;
}

/** PostgreSQL's CPU: the postmaster with every backend it has reaped, and the live ones. */
function postgresCpuMs(postmasterPidFile: string | null): number {
  if (!postmasterPidFile || !fs.existsSync(postmasterPidFile)) return NaN;
  const postmaster = Number(fs.readFileSync(postmasterPidFile, 'utf8').split('\n')[0]);
  const children = fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d)).filter((d) => {
    try {
      return Number(fs.readFileSync(`/proc/${d}/stat`, 'utf8').split(') ')[1].split(' ')[1]) === postmaster;
    } catch {
      return false;
    }
  });
  return cpuMs([postmaster], true) + cpuMs(children.map(Number));
}

/** CPU used by the API processes and PostgreSQL while `work` runs, per request it made. */
async function withCpu(apiPids: number[], pgPidFile: string | null, work: () => Promise<Tally>): Promise<Tally> {
  const before = { api: cpuMs(apiPids), loop: cpuMs(apiPids, false, true), pg: postgresCpuMs(pgPidFile), self: process.cpuUsage(), at: performance.now() };
  const tally = await work();
  const n = Math.max(1, tally.count());
  const self = process.cpuUsage(before.self);
  tally.cpu = {
    apiMsPerRequest: (cpuMs(apiPids) - before.api) / n,
    eventLoopMsPerRequest: (cpuMs(apiPids, false, true) - before.loop) / n,
    pgMsPerRequest: (postgresCpuMs(pgPidFile) - before.pg) / n,
    // This process (autocannon's clients) shares the machine's cores with what it measures.
    loadGeneratorCores: (self.user + self.system) / 1000 / (performance.now() - before.at),
  };
  return tally;
}

const fmt = (x: number, digits = 0) => (Number.isFinite(x) ? x.toFixed(digits) : '-');

function printTally(title: string, tally: Tally, kinds: Kind[]): void {
  log(`\n${title}`);
  log(`  ${'kind'.padEnd(10)} ${'requests'.padStart(8)} ${'req/s'.padStart(7)} ${'p50 ms'.padStart(7)} ${'p99 ms'.padStart(7)} ${'max ms'.padStart(7)} ${'non-2xx'.padStart(7)}`);
  const row = (name: string, kind?: Kind) =>
    log(`  ${name.padEnd(10)} ${String(tally.count(kind)).padStart(8)} ${fmt(tally.count(kind) / tally.seconds, 1).padStart(7)} ${fmt(tally.percentile(50, kind), 1).padStart(7)} ${fmt(tally.percentile(99, kind), 1).padStart(7)} ${fmt(tally.percentile(100, kind), 0).padStart(7)} ${String(tally.failed(kind)).padStart(7)}`);
  for (const k of kinds) if (tally.count(k)) row(k, k);
  if (kinds.length > 1) row('overall');
  log(`  socket errors ${tally.socketErrors}, timeouts ${tally.timeouts}`);
  if (tally.cpu) log(`  CPU per request: API processes ${fmt(tally.cpu.apiMsPerRequest, 2)} ms (main threads ${fmt(tally.cpu.eventLoopMsPerRequest, 2)} ms), PostgreSQL ${fmt(tally.cpu.pgMsPerRequest, 2)} ms; the load generator used ${fmt(tally.cpu.loadGeneratorCores, 2)} of the machine's ${os.cpus().length} cores`);
  for (const [kind, byStatus] of tally.failures) log(`  ${kind} non-2xx by status: ${[...byStatus].map(([s, n]) => `${s}: ${n}`).join(', ')}`);
  for (const [kind, list] of tally.samples) for (const s of list) log(`  ${kind} answered ${s}`);
}

// ---------------------------------------------------------------------------------------------
/** --bare-server <port>: Express + pg, one primary-key SELECT per request, nothing else. */
async function bareServer(port: number): Promise<void> {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const express = require('express') as typeof import('express');
  const { Pool } = await import('pg');
  const pool = new Pool({ connectionString: process.env.DATABASE_URL, max: 20 });
  // The same table as the API reads, seen in the system scope so the row-level policy admits it.
  pool.on('connect', (client) => void client.query("SET app.system = 'on'"));
  const app = express();
  app.get('/health', (_req, res) => res.json({ ok: true }));
  app.get('/runs/:id', async (req, res) => {
    const { rows } = await pool.query('SELECT id, number, state, updated_at FROM test_runs WHERE id = $1', [req.params.id]);
    if (rows.length) res.json(rows[0]);
    else res.status(404).json({ status: 404 });
  });
  app.listen(port, '127.0.0.1');
  process.on('SIGTERM', () => void pool.end().finally(() => process.exit(0)));
}

/** Sequential list requests in one lab: the 1x / 10x / 100x figure. */
async function listLatency(port: number, lab: LabFixture, search: string, n: number): Promise<{ p50: number; p99: number }> {
  const times: number[] = [];
  for (let i = 0; i < n + 10; i++) {
    const t0 = performance.now();
    const res = await fetch(`http://127.0.0.1:${port}/api/runs${search}`, { headers: { authorization: `Bearer ${lab.tokens[0]}`, 'x-organization-id': lab.orgId } });
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`list in ${lab.code} answered ${res.status}`);
    if (i >= 10) times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { p50: times[Math.floor(n / 2)], p99: times[Math.ceil(n * 0.99) - 1] };
}

// ---------------------------------------------------------------------------------------------
async function main(): Promise<void> {
  const args = readArgs(process.argv);
  const base = Number(process.env.LOAD_BASE_PORT ?? 4640);
  const ports = { api: [base, base + 1], smtp: base + 2, smtpHttp: base + 3, payments: base + 4, bare: [base + 5, base + 6] };
  const processes: Started[] = [];
  let failed = 0;
  ensureServerBuild();
  const db = prepareDatabase(args);
  const dataDir = path.join(ROOT, '.data', `bench-load-files-${base}`);
  fs.rmSync(dataDir, { recursive: true, force: true });
  let sequelize: Sequelize | null = null;
  try {
    const env = { ...process.env, DATABASE_URL: db.url, TZ: 'UTC' };
    log(`database: ${db.url.replace(/:[^:@/]+@/, ':***@')}`);
    runChecked(process.execPath, ['dist/server/server/db/migrate-cli.js', 'up'], env);
    runChecked(process.execPath, ['dist/server/server/mail/prepare-queue-cli.js'], env);

    sequelize = createSequelize(db.url, { poolMax: 4 });
    initModels(sequelize);
    const labs = volumeLabs();
    log(`seeding ${labs.length} labs (${labs.map((l) => l.runs.toLocaleString('en')).join(', ')} runs)...`);
    const seeded = await seedVolume(sequelize, labs, log);
    log(`seeded in ${(seeded.ms / 1000).toFixed(1)} s`);
    const fixtures = await loadFixtures(sequelize, labs);

    const appEnv = {
      ...env,
      NODE_ENV: 'production',
      HOST: '127.0.0.1',
      JWT_SECRET: 'load-bench-jwt-secret-not-for-production',
      KEY_ENCRYPTION_SECRET: 'load-bench-key-encryption-secret',
      ACCESS_TOKEN_TTL_SECONDS: '3600',
      PAYMENTS_SECRET_KEY: 'sk_test_sidecheck_load',
      PAYMENTS_WEBHOOK_SECRET: 'whsec_sidecheck_load',
      PAYMENTS_PORT: String(ports.payments),
      SMTP_PORT: String(ports.smtp),
      SMTP_HTTP_PORT: String(ports.smtpHttp),
      FAKES_DATA_DIR: path.join(dataDir, 'fakes'),
      SIDECHECK_DATA_DIR: path.join(dataDir, 'files'),
      CLIENT_DIST_DIR: path.join(dataDir, 'no-client'),
    };
    const fakes = startNode('stand-ins', ['dist/server/fakes/main.js'], { ...appEnv, PAYMENTS_WEBHOOK_URL: `http://127.0.0.1:${ports.api[0]}/api/billing/webhook` });
    processes.push(fakes);
    // The API processes start as scripts/start.sh starts one: with scripts/api-node-flags.
    const apiFlags = fs.readFileSync(path.join(ROOT, 'scripts/api-node-flags'), 'utf8').split(/\s+/).filter(Boolean);
    const extraFlags = process.env.LOAD_API_NODE_ARGS?.split(' ').filter(Boolean) ?? [];
    for (const [i, port] of ports.api.entries()) processes.push(startNode(`api ${i + 1}`, [...apiFlags, ...extraFlags, 'dist/server/server/main.js'], { ...appEnv, PORT: String(port), PUBLIC_URL: `http://127.0.0.1:${ports.api[0]}` }));
    for (const [i, port] of ports.bare.entries()) processes.push(startNode(`bare ${i + 1}`, [...process.execArgv, __filename, '--bare-server', String(port)], env));
    await waitForHttp(`http://127.0.0.1:${ports.smtpHttp}/`, fakes).catch(() => undefined);
    for (const [i, port] of ports.api.entries()) await waitForHttp(`http://127.0.0.1:${port}/api/health`, processes[1 + i]);
    for (const [i, port] of ports.bare.entries()) await waitForHttp(`http://127.0.0.1:${port}/health`, processes[3 + i]);

    // Every person of every lab signs in once (both processes answer sign-ins).
    for (const lab of fixtures) {
      lab.tokens = await Promise.all(lab.engineers.map((email, i) => signIn(ports.api[i % 2], email)));
    }
    log(`signed in ${fixtures.reduce((s, l) => s + l.tokens.length, 0)} engineers in ${fixtures.length} labs; two API processes on ${ports.api.join(' and ')}`);
    const build = requestFactory(fixtures);

    // 1. The bare endpoint.
    const runIds = fixtures.flatMap((l) => l.bench.map((b) => b.runId));
    const bareS = args.quick ? 5 : 15;
    const barePids = processes.filter((p) => p.name.startsWith('bare')).map((p) => p.child.pid!);
    const apiPids = processes.filter((p) => p.name.startsWith('api')).map((p) => p.child.pid!);
    const bare = await withCpu(barePids, db.postmasterPidFile, () => drive({
      ports: ports.bare, instancesPerPort: 1, connections: args.connections, durationS: bareS, choose: () => 'bare',
      build: () => ({ method: 'GET', path: `/runs/${pick(runIds)}` }),
    }));
    printTally(`bare Express + pg primary-key endpoint, closed loop, ${args.connections} connections x 2 processes, ${bareS} s`, bare, ['bare']);
    failed += bare.problems();

    const mixed = () => weightedKind(args.weights);
    // Warm both API processes (connection pools, JIT) outside the figures.
    await drive({ ports: ports.api, instancesPerPort: 1, connections: 4, durationS: 3, choose: mixed, build });

    if (args.perKind) {
      log('\neach kind alone, closed loop, 8 connections x 2 API processes');
      for (const { kind } of MIX.filter((m) => !args.kinds || args.kinds.includes(m.kind))) {
        const alone = await withCpu(apiPids, db.postmasterPidFile, () => drive({ ports: ports.api, instancesPerPort: 1, connections: 8, durationS: args.quick ? 4 : 10, choose: () => kind, build }));
        failed += alone.problems();
        log(`  ${kind.padEnd(10)} ${fmt(alone.count() / alone.seconds, 1).padStart(7)} req/s  p50 ${fmt(alone.percentile(50), 1).padStart(6)} ms  p99 ${fmt(alone.percentile(99), 1).padStart(6)} ms  CPU per request: API ${fmt(alone.cpu!.apiMsPerRequest, 2)} ms (main threads ${fmt(alone.cpu!.eventLoopMsPerRequest, 2)}), PostgreSQL ${fmt(alone.cpu!.pgMsPerRequest, 2)} ms${alone.failed() ? `  non-2xx ${alone.failed()}` : ''}`);
      }
    }
    if (args.kinds) {
      // Profiling mode: the other phases are skipped (the processes stop normally, so --cpu-prof writes).
      if (failed > 0) process.exitCode = 1;
      return;
    }

    // 3. The target rate (measured first when it is the only phase wanted, --rate-only).
    const perPort = Math.max(1, Math.round(args.instances / ports.api.length));
    const spread = perPort * ports.api.length > 10;
    const measureAtRate = async () => {
      const tally = await withCpu(apiPids, db.postmasterPidFile, () => drive({ ports: ports.api, instancesPerPort: perPort, connections: spread ? 2 : 8, durationS: args.durationS, overallRate: args.rate, choose: mixed, build }));
      printTally(`at the target rate: the mix at ${args.rate} req/s offered (${perPort * ports.api.length} autocannon instances x ${spread ? 2 : 8} connections), 2 API processes, ${args.durationS} s`, tally, MIX.map((m) => m.kind));
      if (args.timeline) log(`  p99 / max of lists and saves by 5 s: ${tally.windows(5).map((w) => `${w.fromS}s ${fmt(w.p99, 0)}/${fmt(w.max, 0)}`).join(', ')} ms`);
      failed += tally.problems();
      return tally;
    };
    if (args.rateOnly) {
      const tally = await measureAtRate();
      log(`  p99 run lists / saves ${fmt(tally.percentile(99, 'list'), 1)} / ${fmt(tally.percentile(99, 'save'), 1)} ms | < ${TARGETS.listP99Ms} ms`);
      if (failed > 0) process.exitCode = 1;
      return;
    }

    // 2. Capacity: the mix, closed loop.
    const capacity = await withCpu(apiPids, db.postmasterPidFile, () => drive({ ports: ports.api, instancesPerPort: 1, connections: args.connections, durationS: args.durationS, choose: mixed, build }));
    printTally(`capacity: the mix, closed loop, ${args.connections} connections x 2 API processes, ${args.durationS} s`, capacity, MIX.map((m) => m.kind));
    failed += capacity.problems();

    // List-only capacity, the like-for-like comparison with the bare endpoint.
    const listS = args.quick ? 5 : 15;
    const listOnly = await withCpu(apiPids, db.postmasterPidFile, () => drive({ ports: ports.api, instancesPerPort: 1, connections: args.connections, durationS: listS, choose: () => 'list', build }));
    printTally(`run lists only, closed loop, ${args.connections} connections x 2 API processes, ${listS} s`, listOnly, ['list']);
    failed += listOnly.problems();

    const atRate = await measureAtRate();

    // 3b. Half the measured capacity: the latency when the machine is not saturated.
    const halfRate = Math.max(10, Math.round(capacity.count() / capacity.seconds / 2 / 10) * 10);
    const atHalf = await withCpu(apiPids, db.postmasterPidFile, () => drive({ ports: ports.api, instancesPerPort: perPort, connections: spread ? 2 : 4, durationS: args.durationS, overallRate: halfRate, choose: mixed, build }));
    printTally(`at half the measured capacity: the mix at ${halfRate} req/s offered (${perPort * ports.api.length} instances x ${spread ? 2 : 4} connections), 2 API processes, ${args.durationS} s`, atHalf, MIX.map((m) => m.kind));
    failed += atHalf.problems();

    // 4. Scale: list latency by lab size, one request at a time.
    const scale: { runs: number; first: { p50: number; p99: number }; byClient: { p50: number; p99: number } }[] = [];
    for (const runs of [100, 1_000, 10_000]) {
      const lab = fixtures.find((l) => l.runs === runs)!;
      lab.tokens = lab.tokens.length ? lab.tokens : [await signIn(ports.api[0], lab.engineers[0])];
      scale.push({ runs, first: await listLatency(ports.api[0], lab, '', 100), byClient: await listLatency(ports.api[0], lab, '?sort=client&page=3', 100) });
    }

    const bareRps = bare.count() / bare.seconds;
    const capRps = capacity.count() / capacity.seconds;
    const listRps = listOnly.count() / listOnly.seconds;
    const rateRps = atRate.count() / atRate.seconds;
    log('\nscale: GET /api/runs one at a time (100 requests each)');
    log(`  ${'runs in lab'.padEnd(12)} ${'first page p50/p99 ms'.padStart(22)} ${'by client, page 3 p50/p99 ms'.padStart(30)}`);
    for (const s of scale) log(`  ${s.runs.toLocaleString('en').padEnd(12)} ${`${fmt(s.first.p50, 1)} / ${fmt(s.first.p99, 1)}`.padStart(22)} ${`${fmt(s.byClient.p50, 1)} / ${fmt(s.byClient.p99, 1)}`.padStart(30)}`);

    log('\nsummary (figure | target)');
    log(`  sustained throughput, the mix, closed loop      ${fmt(capRps, 0)} req/s over ${args.durationS} s | ${TARGETS.sustainedRps} req/s for 60 s`);
    log(`  at ${args.rate} req/s offered: served                 ${fmt(rateRps, 0)} req/s | ${args.rate}`);
    log(`  p99 run lists at the target rate               ${fmt(atRate.percentile(99, 'list'), 1)} ms | < ${TARGETS.listP99Ms} ms`);
    log(`  p99 reading saves at the target rate           ${fmt(atRate.percentile(99, 'save'), 1)} ms | < ${TARGETS.saveP99Ms} ms`);
    log(`  p99 run lists / saves at ${halfRate} req/s (half the capacity) ${fmt(atHalf.percentile(99, 'list'), 1)} / ${fmt(atHalf.percentile(99, 'save'), 1)} ms | < ${TARGETS.listP99Ms} ms`);
    log(`  failed requests (non-2xx, socket errors, timeouts) ${failed} | ${TARGETS.errors}`);
    log(`  bare Express + pg primary-key endpoint         ${fmt(bareRps, 0)} req/s`);
    log(`  the mix as a fraction of the bare endpoint     ${fmt(capRps / bareRps, 2)} | >= ${TARGETS.bareFraction}`);
    log(`  run lists as a fraction of the bare endpoint   ${fmt(listRps / bareRps, 2)} | >= ${TARGETS.bareFraction}`);
    log(`  server CPU per request (API + PostgreSQL): bare ${fmt(bare.cpu!.apiMsPerRequest + bare.cpu!.pgMsPerRequest, 2)} ms, the mix ${fmt(capacity.cpu!.apiMsPerRequest + capacity.cpu!.pgMsPerRequest, 2)} ms, run lists ${fmt(listOnly.cpu!.apiMsPerRequest + listOnly.cpu!.pgMsPerRequest, 2)} ms`);
    log(`  load average when done: ${fs.readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ')} on ${os.cpus().length} cores (other work on the machine slows every figure)`);
    log(
      'JSON ' +
        JSON.stringify({
          durationS: args.durationS,
          bareRps: Math.round(bareRps),
          capacityRps: Math.round(capRps),
          listOnlyRps: Math.round(listRps),
          atRate: { offered: args.rate, served: Math.round(rateRps), listP99Ms: +atRate.percentile(99, 'list').toFixed(1), saveP99Ms: +atRate.percentile(99, 'save').toFixed(1) },
          atHalfCapacity: { offered: halfRate, served: Math.round(atHalf.count() / atHalf.seconds), listP99Ms: +atHalf.percentile(99, 'list').toFixed(1), saveP99Ms: +atHalf.percentile(99, 'save').toFixed(1) },
          capacityP99Ms: Object.fromEntries(MIX.map((m) => [m.kind, +capacity.percentile(99, m.kind).toFixed(1)])),
          cpuMsPerRequest: { bare: bare.cpu, capacity: capacity.cpu, listOnly: listOnly.cpu, atRate: atRate.cpu },
          failed,
          scale,
        }),
    );
    if (failed > 0) for (const p of processes.filter((x) => x.name.startsWith('api'))) log(`\n[${p.name} output, last lines]\n${p.output().split('\n').slice(-30).join('\n')}`);
  } finally {
    await stopAll(processes);
    await sequelize?.close();
    db.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
  if (failed > 0) {
    console.error(`${failed} request(s) failed`);
    process.exit(1);
  }
}

if (process.argv.includes('--bare-server')) {
  void bareServer(Number(process.argv[process.argv.indexOf('--bare-server') + 1]));
} else {
  main().catch((error) => {
    console.error(error instanceof Error ? error.stack : error);
    process.exit(1);
  });
}
