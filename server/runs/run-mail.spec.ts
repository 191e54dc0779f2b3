/**
 * The review step's e-mails, read from the real pg-boss queue: they exist exactly when the
 * transition committed (enqueued in the request's transaction).
 */
import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser, signIn } from '../../test/support/factories';
import { mailJobs } from '../billing/billing-stack.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

async function setup() {
  const s = await buildLabScenario(t.sequelize);
  const as = async (user: { email: string }) => {
    const { token } = await signIn(t.app, user.email);
    return (method: 'get' | 'post' | 'put', path: string, body?: object) => {
      const r = request(t.app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id);
      return body ? r.send(body) : r;
    };
  };
  const engineer = await as(s.engineer);
  const reviewer = await as(s.reviewer);
  const run = (await engineer('post', '/runs', { planId: s.plan.id })).body as { id: string; number: string; testCases: { id: string }[] };
  return { s, engineer, reviewer, run };
}

/** Mail jobs of one run: its number is unique per lab, and each test has its own lab (device serial tells them apart). */
const jobsFor = async (subjectPart: string, serial: string) => (await mailJobs(t, subjectPart)).filter((j) => j.data.subject.includes(serial)).map((j) => j.data);

describe('e-mails of the review step', () => {
  it('submitting a run mails each reviewer of the lab once, with the run, the device and the review link; a refused submit mails nobody', async () => {
    const { s, engineer, run } = await setup();
    const secondReviewer = await buildUser(t.sequelize, s.lab.id, ['reviewer']);
    expect((await engineer('post', `/runs/${run.id}/submit`)).status).toBe(409); // no results yet
    expect(await jobsFor('is ready for review', s.device.serialNumber)).toHaveLength(0);

    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
    expect((await engineer('post', `/runs/${run.id}/submit`)).status).toBe(200);
    const mails = await jobsFor('is ready for review', s.device.serialNumber);
    expect(mails.map((m) => m.to).sort()).toEqual([s.reviewer.email, secondReviewer.email].sort());
    for (const m of mails) {
      expect(m.subject).toBe(`Run ${run.number} is ready for review: ${s.device.manufacturer} TX-1 test radio (s/n ${s.device.serialNumber})`);
      expect(m.text).toContain(`http://127.0.0.1:4610/runs/${run.id}/review`);
      expect(m.text).toContain(s.engineer.displayName);
    }
  });

  it('returning a run mails the engineer who submitted it the reviewer’s reason and the link to the run', async () => {
    const { s, engineer, reviewer, run } = await setup();
    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
    await engineer('post', `/runs/${run.id}/submit`);
    // Refused (a reason is required): nothing is mailed.
    expect((await reviewer('post', `/runs/${run.id}/return`, {})).status).toBe(422);
    expect(await jobsFor('was returned for rework', s.device.serialNumber)).toHaveLength(0);

    const reason = 'Carrier read with 1 kHz RBW; repeat at 10 Hz.';
    expect((await reviewer('post', `/runs/${run.id}/return`, { reason })).status).toBe(200);
    const mails = await jobsFor('was returned for rework', s.device.serialNumber);
    expect(mails).toHaveLength(1);
    expect(mails[0].to).toBe(s.engineer.email);
    expect(mails[0].text).toContain(`Reason: ${reason}`);
    expect(mails[0].text).toContain(`Open the run: http://127.0.0.1:4610/runs/${run.id}`);
    expect(mails[0].text).toContain(s.reviewer.displayName);
  });
});
