import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser } from '../../test/support/factories';
import { callerFor, instrumentBody } from '../instruments/lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

describe('GET /api/home', () => {
  it('counts runs by state, lists what waits for my review, calibration due and the latest activity', async () => {
    const s = await buildLabScenario(t.sequelize);
    const other = await buildLabScenario(t.sequelize);
    const engineer = await callerFor(t.app, s.engineer, s.lab.id);
    const reviewer = await callerFor(t.app, s.reviewer, s.lab.id);
    // Someone who both measures and reviews: the runs they took readings on are not theirs to review.
    const both = await buildUser(t.sequelize, s.lab.id, ['engineer', 'reviewer']);
    const bothCaller = await callerFor(t.app, both, s.lab.id);

    const start = async () => (await engineer('post', '/runs', { planId: s.plan.id })).body as { id: string; number: string; testCases: { id: string }[] };
    const measureAndSubmit = async (run: { id: string; testCases: { id: string }[] }, by = engineer) => {
      await by('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
      expect((await engineer('post', `/runs/${run.id}/submit`)).status).toBe(200);
    };
    const plain = await start();
    await measureAndSubmit(plain);
    const measuredByBoth = await start();
    await measureAndSubmit(measuredByBoth, bothCaller);
    await start(); // stays on the bench
    // The other lab's run in review never shows here.
    const otherEngineer = await callerFor(t.app, other.engineer, other.lab.id);
    const theirs = (await otherEngineer('post', '/runs', { planId: other.plan.id })).body;
    await otherEngineer('put', `/runs/${theirs.id}/cases/${theirs.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
    await otherEngineer('post', `/runs/${theirs.id}/submit`);

    const soon = (await engineer('post', '/instruments', instrumentBody(10, { name: 'Due soon' }))).body;
    const late = (await engineer('post', '/instruments', instrumentBody(-2, { name: 'Overdue' }))).body;
    await engineer('post', '/instruments', instrumentBody(200, { name: 'Fine' }));

    const home = await reviewer('get', '/home');
    expect(home.status).toBe(200);
    expect(home.body.runsByState).toEqual({ draft: 0, testing: 1, 'in-review': 2, approved: 0, issued: 0, withdrawn: 0, superseded: 0 });
    expect(home.body.awaitingMyReview.map((r: { id: string }) => r.id).sort()).toEqual([plain.id, measuredByBoth.id].sort());
    expect(home.body.awaitingMyReview[0]).toMatchObject({ state: 'in-review', model: s.device.model, client: s.client.name });
    expect(home.body.calibrationDue.map((i: { id: string; calibrationStatus: string }) => [i.id, i.calibrationStatus])).toEqual([[late.id, 'overdue'], [soon.id, 'due-soon']]);

    // Four eyes: the engineer who owns the runs, and the person who took a reading, see fewer.
    expect((await engineer('get', '/home')).body.awaitingMyReview).toEqual([]);
    expect((await bothCaller('get', '/home')).body.awaitingMyReview.map((r: { id: string }) => r.id)).toEqual([plain.id]);

    const activity = home.body.recentActivity as { at: string; who: { userId: string; displayName: string } | null; action: string; entity: string; entityId: string }[];
    expect(activity).toHaveLength(10);
    expect(activity[0]).toMatchObject({ action: 'create', entity: 'instrument', who: { userId: s.engineer.id, displayName: s.engineer.displayName } });
    const times = activity.map((a) => Date.parse(a.at));
    expect([...times].sort((x, y) => y - x)).toEqual(times);
    expect(activity.map((a) => a.entityId)).not.toContain(theirs.id);
  });

  it('answers an empty lab with zero counts and empty lists', async () => {
    const s = await buildLabScenario(t.sequelize);
    const billing = await callerFor(t.app, s.billing, s.lab.id);
    const home = await billing('get', '/home');
    expect(home.status).toBe(200);
    expect(Object.values(home.body.runsByState).every((n) => n === 0)).toBe(true);
    expect(home.body).toMatchObject({ awaitingMyReview: [], calibrationDue: [], recentActivity: [] });
  });
});
