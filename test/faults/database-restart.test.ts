/**
 * Fault: PostgreSQL stops (pg_ctl stop -m fast) and starts again under a steady stream of
 * requests, on a private cluster of this test (the suite's shared cluster is never restarted).
 * While it is down every request must fail cleanly and quickly — 503 problem+json with
 * Retry-After on API routes, 503 with `database: down` on /api/health, no 500, no hang, the
 * server process alive — and once it is back the same server process must answer again.
 */
import type { Sequelize } from 'sequelize';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { buildLabScenario, TEST_PASSWORD } from '../support/factories';
import { createPrivateCluster, prepareDatabase, type PrivateCluster } from '../support/private-cluster';
import { call, signedIn, startServer, waitFor, type Api, type ProductServer } from '../support/product-server';

jest.setTimeout(120_000);

const PORT = 5021;
const PG_PORT = 54631;
/** An answer slower than this counts as a hang (common practice: well below a browser's patience, above the pool's connect time). */
const HANG_MS = 5_000;

type Phase = 'up' | 'stopping' | 'down' | 'starting' | 'recovering' | 'recovered';
interface Sample {
  phase: Phase;
  route: string;
  status: number | 'hang' | 'network-error';
  ms: number;
  contentType: string;
  retryAfter: string | null;
  body: { code?: string; status?: unknown; database?: { status?: string } } | undefined;
}

let cluster: PrivateCluster;
let server: ProductServer;
let engineer: Api;
let sequelize: Sequelize;

beforeAll(async () => {
  cluster = await createPrivateCluster('pg-faults-restart', PG_PORT);
  await prepareDatabase(cluster.url);
  sequelize = createSequelize(cluster.url, { poolMax: 2 });
  initModels(sequelize);
  const s = await buildLabScenario(sequelize);
  await sequelize.close();
  server = await startServer({ port: PORT, databaseUrl: cluster.url });
  engineer = await signedIn(server.base, s.engineer.email, TEST_PASSWORD, s.lab.id);
  expect((await engineer('POST', '/runs', { planId: s.plan.id })).status).toBe(201);
});

afterAll(async () => {
  await server?.stop();
  await cluster?.destroy();
});

test('requests fail with 503 while PostgreSQL is down and succeed again after it restarts, without restarting the server', async () => {
  const pid = server.process.pid;
  let phase: Phase = 'up';
  let running = true;
  const samples: Sample[] = [];
  const routes: [string, () => ReturnType<Api>][] = [
    ['GET /api/runs', () => engineer('GET', '/runs', undefined, { timeoutMs: HANG_MS })],
    ['GET /api/home', () => engineer('GET', '/home', undefined, { timeoutMs: HANG_MS })],
    ['GET /api/health', () => call(server.base, 'GET', '/health', { timeoutMs: HANG_MS })],
  ];
  // Four clients, each sending one request after another with a 40 ms pause: bounded by `running`.
  const client = async (offset: number) => {
    for (let i = offset; running; i++) {
      const [route, send] = routes[i % routes.length];
      const at = phase;
      const t0 = Date.now();
      const sample: Sample = { phase: at, route, status: 'network-error', ms: 0, contentType: '', retryAfter: null, body: undefined };
      try {
        const res = await send();
        Object.assign(sample, { status: res.status, contentType: res.headers.get('content-type') ?? '', retryAfter: res.headers.get('retry-after'), body: res.body });
      } catch (error) {
        sample.status = (error as Error).name === 'TimeoutError' ? 'hang' : 'network-error';
      }
      sample.ms = Date.now() - t0;
      samples.push(sample);
      await new Promise((resolve) => setTimeout(resolve, 40));
    }
  };
  const clients = Promise.all([0, 1, 2, 3].map(client));
  const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

  await pause(1000);
  // Two outages: requests caught mid-query by the shutdown are the rare case, so give it two chances.
  const recoveryMs: number[] = [];
  for (let outage = 0; outage < 2; outage++) {
    phase = 'stopping';
    await cluster.stop();
    phase = 'down';
    await pause(2000);
    phase = 'starting';
    await cluster.start();
    const back = Date.now();
    const seen = samples.length;
    phase = 'recovering';
    await waitFor('the API to answer 200 again', async () => (samples.slice(seen).some((x) => x.route === 'GET /api/runs' && x.status === 200) ? true : undefined), 20_000);
    recoveryMs.push(Date.now() - back);
    phase = 'recovered';
    await pause(1000);
  }
  running = false;
  await clients;

  const of = (p: Phase) => samples.filter((x) => x.phase === p);
  const summary = (p: Phase) => of(p).map((x) => `${x.route} ${x.status}`).reduce<Record<string, number>>((acc, k) => ((acc[k] = (acc[k] ?? 0) + 1), acc), {});
  console.log(`samples: ${samples.length}; by phase: ${JSON.stringify(Object.fromEntries((['up', 'stopping', 'down', 'starting', 'recovering', 'recovered'] as Phase[]).map((p) => [p, summary(p)])))}; first 200 after each start: ${recoveryMs.join(', ')} ms; slowest answer: ${Math.max(...samples.map((x) => x.ms))} ms`);

  // Before the outage everything works.
  expect(of('up').length).toBeGreaterThan(3);
  expect(of('up').filter((x) => x.status !== 200)).toEqual([]);
  // Nothing ever hangs, breaks the connection, or answers 500; every failure is a 503.
  expect(samples.filter((x) => typeof x.status !== 'number' || x.ms >= HANG_MS)).toEqual([]);
  // The server logs every error it answers with a 500: there must be none, and it shows why if not.
  const unhandled = server.output().split('\n').filter((line) => line.includes('unhandled error'));
  expect({ failures: samples.filter((x) => x.status !== 200 && x.status !== 503), unhandled }).toEqual({ failures: [], unhandled: [] });
  // While it is down: 503 only, problem+json with Retry-After on API routes, "database down" on health.
  const down = of('down');
  expect(down.length).toBeGreaterThan(10);
  expect(down.filter((x) => x.status !== 503)).toEqual([]);
  for (const x of down) {
    if (x.route === 'GET /api/health') {
      expect(x.body?.database?.status).toBe('down');
    } else {
      expect({ route: x.route, contentType: x.contentType, code: x.body?.code, retryAfter: x.retryAfter }).toEqual({ route: x.route, contentType: expect.stringMatching(/^application\/problem\+json/), code: 'service-unavailable', retryAfter: expect.stringMatching(/^\d+$/) });
    }
  }
  // Back up: the same process answers every request again.
  expect(of('recovered').length).toBeGreaterThan(3);
  expect(of('recovered').filter((x) => x.status !== 200)).toEqual([]);
  expect(server.process.exitCode).toBeNull();
  expect(server.process.pid).toBe(pid);
});
