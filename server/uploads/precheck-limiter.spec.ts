import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildUser } from '../../test/support/factories';
import { Problem } from '../http/problem';
import { createPrecheckLimiter } from './precheck-limiter';

let t: TestApp;

beforeAll(async () => {
  t = await startTestApp();
});

afterAll(() => t?.close());

async function refusal(take: Promise<void>): Promise<Problem | undefined> {
  try {
    await take;
    return undefined;
  } catch (error) {
    return error as Problem;
  }
}

/** A start `minutesAgo` minutes back, written as an earlier start would have been. */
async function startedAgo(userId: string, minutesAgo: number): Promise<void> {
  await t.sequelize.query("INSERT INTO precheck_starts (user_id, started_at) VALUES (:userId, now() - make_interval(mins => :minutesAgo))", { replacements: { userId, minutesAgo } });
}

describe('createPrecheckLimiter (counted in PostgreSQL)', () => {
  it('allows perHour starts in any sliding hour, per person, then answers 429 with the wait', async () => {
    const [a, b] = [await buildUser(t.sequelize, null, []), await buildUser(t.sequelize, null, [])];
    const limiter = createPrecheckLimiter(t.sequelize, 2);
    await startedAgo(a.id, 20);
    await limiter.take(a.id);
    await limiter.take(b.id); // someone else has their own allowance
    const refused = await refusal(limiter.take(a.id));
    expect(refused?.status).toBe(429);
    // The start 20 minutes ago leaves the window 60 minutes after it: about 40 minutes from now.
    const waitSeconds = Number(refused?.headers?.['Retry-After']);
    expect(waitSeconds).toBeGreaterThan(39 * 60);
    expect(waitSeconds).toBeLessThanOrEqual(40 * 60);
  });

  it('forgets starts older than an hour', async () => {
    const a = await buildUser(t.sequelize, null, []);
    const limiter = createPrecheckLimiter(t.sequelize, 2);
    await startedAgo(a.id, 61);
    await startedAgo(a.id, 90);
    await limiter.take(a.id);
    await limiter.take(a.id);
    expect((await refusal(limiter.take(a.id)))?.status).toBe(429);
  });

  it('is one allowance for every API process: two limiters share the count, also when racing', async () => {
    const a = await buildUser(t.sequelize, null, []);
    const [first, second] = [createPrecheckLimiter(t.sequelize, 3), createPrecheckLimiter(t.sequelize, 3)];
    const outcomes = await Promise.all([first, second, first, second, first].map((l) => refusal(l.take(a.id))));
    // Five attempts at once against an allowance of three: exactly three start.
    expect(outcomes.filter((o) => o === undefined)).toHaveLength(3);
    expect(outcomes.filter((o) => o?.status === 429)).toHaveLength(2);
  });
});
