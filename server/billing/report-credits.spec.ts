/**
 * Report credits at issue: one credit per issued report, taken in the issue's own transaction,
 * refused when none is left (unless invoice-later), given back on withdrawal within the lab's
 * policy. Real app, real database; the failing issue fails for real (a signing key the server
 * cannot decrypt), nothing is mocked.
 */
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { Client, SigningIdentity } from '../db/models';
import { asSystem, inTenant } from '../tenancy/tenant-transaction';
import { generateLabSigningIdentity } from '../signing/generate-lab-signing-identity';
import { encryptPrivateKey } from '../signing/private-key-encryption';
import { actingAs, ledgerOf, mailJobs } from './billing-stack.test-support';
import { refundCreditForReport } from './refund-credit-for-report';
import type { Principal } from '../http/route';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

/** A lab scenario with a price list, `credits` starting credits for its client and an approved run. */
async function approvedRun(options: { credits?: number; priceList?: boolean; refundDays?: number; invoiceLater?: boolean } = {}) {
  const s = await buildLabScenario(t.sequelize);
  const admin = await actingAs(t, s.admin, s.lab.id);
  const engineer = await actingAs(t, s.engineer, s.lab.id);
  const reviewer = await actingAs(t, s.reviewer, s.lab.id);
  if (options.priceList !== false) {
    const body = { currency: 'GBP', packs: [{ credits: 5, priceMinor: 80_000 }], ...(options.refundDays === undefined ? {} : { refundOnWithdrawWithinDays: options.refundDays }) };
    expect((await admin('put', '/billing/price-list', body)).status).toBe(200);
  }
  if (options.credits) {
    expect((await admin('post', '/billing/adjustments', { clientId: s.client.id, credits: options.credits, reason: 'Starting balance' })).status).toBe(201);
  }
  if (options.invoiceLater) await asSystem(t.sequelize, () => Client.update({ invoiceLater: true }, { where: { id: s.client.id } }));
  const newApprovedRun = async () => {
    const run = (await engineer('post', '/runs', { planId: s.plan.id })).body;
    // 47 CFR 80.207(c): J3E carrier at least 40 dB below PEP; 51 - 8.2 = 42.8 dB passes (arithmetic).
    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 51, carrierDbm: 8.2 } });
    await engineer('post', `/runs/${run.id}/submit`);
    expect((await reviewer('post', `/runs/${run.id}/approve`)).status).toBe(200);
    return run as { id: string };
  };
  return { s, admin, reviewer, run: await newApprovedRun(), newApprovedRun };
}

const labCtx = (s: Awaited<ReturnType<typeof buildLabScenario>>, userId: string) => {
  const principal: Principal = { userId, email: 'x@test.example', displayName: 'X', memberships: [{ organizationId: s.lab.id, kind: 'lab', roles: ['lab-admin'] }] };
  return { organizationId: s.lab.id, principal, transaction: null };
};

describe('issuing a report consumes one credit of its client at the lab', () => {
  it('takes exactly one credit, in the same database transaction as the report, and warns at a balance of 1', async () => {
    const { s, reviewer, run } = await approvedRun({ credits: 2 });
    const issued = await reviewer('post', `/runs/${run.id}/issue`);
    expect(issued.status).toBe(201);
    const ledger = await ledgerOf(t, s.lab.id, s.client.id);
    expect(ledger.balance).toBe(1);
    expect(ledger.rows.filter((r) => r.kind === 'consumption')).toEqual([{ kind: 'consumption', credits: -1, report_id: issued.body.id, provider_event_id: null }]);
    // xmin is the id of the transaction that inserted a row (PostgreSQL system column): equal means one transaction.
    const [xmins] = await asSystem(t.sequelize, () =>
      t.sequelize.query<{ ledger: string; report: string }>(
        `SELECT (SELECT xmin::text FROM credit_ledger WHERE report_id = :id) AS ledger, (SELECT xmin::text FROM reports WHERE id = :id) AS report`,
        { replacements: { id: issued.body.id }, type: QueryTypes.SELECT },
      ),
    );
    expect(xmins.ledger).toBe(xmins.report);
    const low = await mailJobs(t, `${s.client.name} has one report credit left`);
    expect(low).toHaveLength(1);
    expect(low[0].data.to).toBe(s.client.contactEmail);
  });

  it('a failing issue (the signing key cannot be decrypted) takes no credit; the retry after the fix takes one', async () => {
    const { s, reviewer, run } = await approvedRun({ credits: 1 });
    // A real failure after the credit is taken: a key encrypted under another master secret (AES-GCM refuses it).
    const identity = generateLabSigningIdentity({ labName: s.lab.name });
    const broken = await asSystem(t.sequelize, () =>
      SigningIdentity.create({ organizationId: s.lab.id, certificatePem: identity.certificatePem, encryptedPrivateKey: encryptPrivateKey(identity.privateKeyPem, 'another-master-secret-0123456789', { context: s.lab.id }), source: 'uploaded' }),
    );
    const failed = await reviewer('post', `/runs/${run.id}/issue`);
    expect(failed.status).toBe(500);
    expect(String(t.logs[t.logs.length - 1].error)).toMatch(/decryptPrivateKey/);
    expect(await ledgerOf(t, s.lab.id, s.client.id)).toMatchObject({ balance: 1, rows: [{ kind: 'adjustment' }] });
    expect((await reviewer('get', `/runs/${run.id}`)).body.state).toBe('approved');
    await asSystem(t.sequelize, () => SigningIdentity.update({ active: false }, { where: { id: broken.id } }));
    expect((await reviewer('post', `/runs/${run.id}/issue`)).status).toBe(201);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).balance).toBe(0);
    // The last credit is gone: the contact is told (balance 0 <= 1).
    expect(await mailJobs(t, `${s.client.name} has no report credits left`)).toHaveLength(1);
  });

  it('refuses the issue with 409 when the client has no credit left, and changes nothing', async () => {
    const { s, reviewer, run } = await approvedRun({ credits: 0 });
    const res = await reviewer('post', `/runs/${run.id}/issue`);
    expect(res.status).toBe(409);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
    expect(res.body.code).toBe('no-report-credits');
    expect(res.body.detail).toContain(`${s.client.name} has no report credits left with this lab;`);
    expect((await reviewer('get', `/runs/${run.id}`)).body.state).toBe('approved');
    expect((await reviewer('get', '/reports')).body.total).toBe(0);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).rows).toEqual([]);
  });

  it('issues for an invoice-later client without credits: the balance goes below zero for the lab to invoice', async () => {
    const { s, reviewer, run } = await approvedRun({ credits: 0, invoiceLater: true });
    expect((await reviewer('post', `/runs/${run.id}/issue`)).status).toBe(201);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).balance).toBe(-1);
    expect(await mailJobs(t, `${s.client.name} has no report credits left`)).toHaveLength(0);
  });

  it('takes nothing at a lab that sells no credits, nor for a corrected revision', async () => {
    const free = await approvedRun({ priceList: false });
    expect((await free.reviewer('post', `/runs/${free.run.id}/issue`)).status).toBe(201);
    expect((await ledgerOf(t, free.s.lab.id, free.s.client.id)).rows).toEqual([]);

    const { s, reviewer, run } = await approvedRun({ credits: 3 });
    expect((await reviewer('post', `/runs/${run.id}/issue`)).status).toBe(201);
    const engineer = await actingAs(t, s.engineer, s.lab.id);
    await reviewer('post', `/runs/${run.id}/revise`, { reason: 'Carrier re-measured' });
    await engineer('put', `/runs/${run.id}/cases/${(await engineer('get', `/runs/${run.id}`)).body.testCases[0].id}/reading`, { values: { pepDbm: 51, carrierDbm: 7.9 } });
    await engineer('post', `/runs/${run.id}/submit`);
    await reviewer('post', `/runs/${run.id}/approve`);
    const second = await reviewer('post', `/runs/${run.id}/issue`);
    expect(second.status).toBe(201);
    expect(second.body.revision).toBe(2);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).balance).toBe(2);
  });
});

describe('refundCreditForReport (for the withdraw endpoint)', () => {
  it('gives the credit back once, within the lab’s policy', async () => {
    const { s, reviewer, run } = await approvedRun({ credits: 2, refundDays: 14 });
    const issued = (await reviewer('post', `/runs/${run.id}/issue`)).body;
    const ctx = labCtx(s, s.admin.id);
    const first = await inTenant(t.sequelize, s.lab.id, (transaction) => refundCreditForReport({ ...ctx, transaction }, issued.id, 'Withdrawn: wrong serial number'));
    expect(first).toEqual({ refunded: true, clientId: s.client.id, balanceAfter: 2 });
    const again = await inTenant(t.sequelize, s.lab.id, (transaction) => refundCreditForReport({ ...ctx, transaction }, issued.id, 'again'));
    expect(again).toEqual({ refunded: false, reason: 'already-refunded' });
    const ledger = await ledgerOf(t, s.lab.id, s.client.id);
    expect(ledger.rows.map((r) => r.kind)).toEqual(['adjustment', 'consumption', 'refund']);
    expect(ledger.balance).toBe(2);
  });

  it('refunds nothing outside the period, without a policy, or for another lab’s report', async () => {
    const zero = await approvedRun({ credits: 1, refundDays: 0 });
    const issued = (await zero.reviewer('post', `/runs/${zero.run.id}/issue`)).body;
    await new Promise((resolve) => setTimeout(resolve, 5)); // a few ms after issue is already past 0 days
    const inZero = (fn: typeof refundCreditForReport, id: string) => inTenant(t.sequelize, zero.s.lab.id, (transaction) => fn({ ...labCtx(zero.s, zero.s.admin.id), transaction }, id, 'Withdrawn'));
    expect(await inZero(refundCreditForReport, issued.id)).toEqual({ refunded: false, reason: 'outside-refund-period' });

    const none = await approvedRun({ credits: 1 });
    const other = (await none.reviewer('post', `/runs/${none.run.id}/issue`)).body;
    expect(await inTenant(t.sequelize, none.s.lab.id, (transaction) => refundCreditForReport({ ...labCtx(none.s, none.s.admin.id), transaction }, other.id, 'Withdrawn'))).toEqual({ refunded: false, reason: 'no-refund-policy' });
    await expect(inZero(refundCreditForReport, other.id)).rejects.toMatchObject({ status: 404 });
    expect((await ledgerOf(t, zero.s.lab.id, zero.s.client.id)).balance).toBe(0);
  });
});

describe('the credit ledger', () => {
  it('refuses UPDATE and DELETE in the database (append-only trigger), even in system scope', async () => {
    const { s } = await approvedRun({ credits: 4 });
    await expect(inTenant(t.sequelize, s.lab.id, () => t.sequelize.query('UPDATE credit_ledger SET credits = 400 WHERE client_id = :id', { replacements: { id: s.client.id } }))).rejects.toThrow(/immutable/);
    await expect(asSystem(t.sequelize, () => t.sequelize.query('DELETE FROM credit_ledger WHERE client_id = :id', { replacements: { id: s.client.id } }))).rejects.toThrow(/immutable/);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).balance).toBe(4);
  });

  it('is read by the lab and its client manufacturer only: other labs, other manufacturers and no scope see nothing', async () => {
    const { s, admin } = await approvedRun({ credits: 4 });
    const other = await buildLabScenario(t.sequelize);
    const count = (org: string | null) => inTenant(t.sequelize, org, async () => Number((await t.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM credit_ledger WHERE client_id = :id', { replacements: { id: s.client.id }, type: QueryTypes.SELECT }))[0].n));
    expect(await count(s.lab.id)).toBe(1);
    expect(await count(s.maker.id)).toBe(1);
    expect(await count(other.lab.id)).toBe(0);
    expect(await count(other.maker.id)).toBe(0);
    expect(await count(null)).toBe(0);
    // The same through the API: the statement of each side.
    expect((await admin('get', '/billing/ledger')).body.items.map((r: { balanceAfter: number }) => r.balanceAfter)).toEqual([4]);
    const maker = await actingAs(t, s.makerViewer, s.maker.id);
    expect((await maker('get', '/billing/ledger')).body).toMatchObject({ total: 1, items: [{ kind: 'adjustment', credits: 4, lab: { id: s.lab.id } }] });
    const stranger = await actingAs(t, other.makerViewer, other.maker.id);
    expect((await stranger('get', '/billing/ledger')).body.total).toBe(0);
    expect((await stranger('get', '/billing/balance')).body.items.map((a: { lab: { id: string } }) => a.lab.id)).not.toContain(s.lab.id);
    // The client manufacturer may read its rows but not write any, nor a completed purchase.
    await expect(inTenant(t.sequelize, s.maker.id, () => t.sequelize.query(`INSERT INTO credit_ledger (organization_id, client_id, kind, credits, reason, created_by) VALUES (:lab, :client, 'adjustment', 100, 'free', :user)`, { replacements: { lab: s.lab.id, client: s.client.id, user: s.makerAdmin.id } }))).rejects.toThrow(/row-level security/);
    await expect(inTenant(t.sequelize, s.maker.id, () => t.sequelize.query(`INSERT INTO credit_purchases (organization_id, client_id, buyer_organization_id, pack_id, credits, amount_minor, currency, status, completed_at) VALUES (:lab, :client, :maker, 'pack-5', 5, 1, 'GBP', 'completed', now())`, { replacements: { lab: s.lab.id, client: s.client.id, maker: s.maker.id } }))).rejects.toThrow(/row-level security/);
    // A lab that another lab records as its client does not see that record (the narrow policy is for manufacturers).
    const labAsClient = await asSystem(t.sequelize, () => Client.create({ organizationId: s.lab.id, clientOrganizationId: other.lab.id, name: 'A lab as client', contactName: 'N', contactEmail: 'n@lab.example' }));
    expect(await inTenant(t.sequelize, other.lab.id, () => Client.count({ where: { id: labAsClient.id } }))).toBe(0);
    // A lab cannot write into another lab's ledger: its client is not found there.
    const otherAdmin = await actingAs(t, other.admin, other.lab.id);
    expect((await otherAdmin('post', '/billing/adjustments', { clientId: s.client.id, credits: 5, reason: 'x' })).status).toBe(404);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).balance).toBe(4);
  });

  it('adjustments need a reason and a non-zero whole number of credits; bad input stores nothing', async () => {
    const { s, admin } = await approvedRun();
    for (const body of [{ clientId: s.client.id, credits: 0, reason: 'x' }, { clientId: s.client.id, credits: 1.5, reason: 'x' }, { clientId: s.client.id, credits: 2, reason: '   ' }, { clientId: s.client.id, credits: 2 }, { clientId: s.client.id, credits: 2, reason: 'x', extra: 1 }]) {
      const res = await admin('post', '/billing/adjustments', body);
      expect(res.status).toBe(422);
    }
    expect((await ledgerOf(t, s.lab.id, s.client.id)).rows).toEqual([]);
  });
});

describe('two issues at once', () => {
  it('cannot both take the last credit: one is issued, the other refused', async () => {
    const { s, reviewer, run, newApprovedRun } = await approvedRun({ credits: 1 });
    const second = await newApprovedRun();
    const [a, b] = await Promise.all([reviewer('post', `/runs/${run.id}/issue`), reviewer('post', `/runs/${second.id}/issue`)]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect((await ledgerOf(t, s.lab.id, s.client.id)).balance).toBe(0);
  });
});

describe('checkout while the payment service is unreachable', () => {
  it('answers 503 saying nothing was charged, and stores no purchase', async () => {
    // startTestApp points the payment client at 127.0.0.1:1, where nothing listens.
    const { s } = await approvedRun();
    const maker = await actingAs(t, s.makerAdmin, s.maker.id);
    const res = await maker('post', '/billing/checkout', { labId: s.lab.id, packId: 'pack-5' });
    expect(res.status).toBe(503);
    expect(res.body.detail).toMatch(/nothing was charged/);
    expect((await maker('get', '/billing/purchases')).body.total).toBe(0);
  });
});
