/**
 * The tenant transaction writes START TRANSACTION with its first statement, and a hot path its
 * last statement with the COMMIT (node-postgres pipeline mode; server/db/prepared-query.ts).
 * These check what must not change with it: the setting reaches every statement, a COMMIT sent
 * early really commits, a failure anywhere rolls everything back, and the pooled connection is
 * fit for the next request afterwards. Expected behaviour from PostgreSQL's documentation
 * (protocol, "Pipelining" and "Extended Query": an error skips to the next Sync; COMMIT of a
 * failed transaction block answers ROLLBACK).
 */
import net from 'node:net';
import { DatabaseError, QueryTypes, type Transaction } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { preparedRows } from '../db/prepared-query';
import { inTenant } from './tenant-transaction';

let t: TestApp;
let lab: Awaited<ReturnType<typeof buildLabScenario>>;
beforeAll(async () => {
  t = await startTestApp();
  lab = await buildLabScenario(t.sequelize);
});
afterAll(() => t?.close());

const finished = (transaction: Transaction) => (transaction as unknown as { finished?: string }).finished;

async function modelOf(deviceId: string): Promise<string> {
  return inTenant(t.sequelize, lab.lab.id, async (transaction) => {
    const [row] = await preparedRows<{ model: string }>(transaction, 'SELECT model FROM devices WHERE id = $1', [deviceId]);
    return row.model;
  });
}

describe('the pipelined tenant transaction', () => {
  it('runs on connections in pipeline mode, and the tenant setting reaches the first and every later statement', async () => {
    const seen = await inTenant(t.sequelize, lab.lab.id, async (transaction) => {
      const connection = (transaction as unknown as { connection: { pipeline?: boolean } }).connection;
      const [viaModel] = await t.sequelize.query<{ org: string }>("SELECT current_setting('app.org_id') AS org", { type: QueryTypes.SELECT });
      const [viaPrepared] = await preparedRows<{ org: string; devices: string }>(transaction, "SELECT current_setting('app.org_id') AS org, (SELECT count(*) FROM devices) AS devices", []);
      return { pipeline: connection.pipeline, viaModel: viaModel.org, viaPrepared };
    });
    expect(seen.pipeline).toBe(true);
    expect(seen.viaModel).toBe(lab.lab.id);
    expect(seen.viaPrepared.org).toBe(lab.lab.id);
    expect(Number(seen.viaPrepared.devices)).toBeGreaterThan(0); // row-level security admits the lab's own devices
  });

  it('answers the caller’s current roles from the first statement', async () => {
    const roles = await inTenant(t.sequelize, lab.lab.id, async (_transaction, held) => held, lab.engineer.id);
    expect(roles).toEqual(['engineer']);
  });

  it('thenCommit commits with the last statement: the change is kept and the transaction is over', async () => {
    const transactions: Transaction[] = [];
    let afterCommit = 0;
    const model = `Committed early ${Date.now()}`;
    await inTenant(t.sequelize, lab.lab.id, async (transaction) => {
      transactions.push(transaction);
      transaction.afterCommit(() => void (afterCommit += 1));
      await preparedRows(transaction, 'UPDATE devices SET model = $1 WHERE id = $2', [model, lab.device.id], { thenCommit: true });
    });
    expect(finished(transactions[0])).toBe('commit');
    expect(afterCommit).toBe(1);
    expect(await modelOf(lab.device.id)).toBe(model);
  });

  it('a failing last statement rolls back the whole transaction, earlier statements too, and answers a DatabaseError', async () => {
    const before = await modelOf(lab.device.id);
    const transactions: Transaction[] = [];
    const attempt = inTenant(t.sequelize, lab.lab.id, async (transaction) => {
      transactions.push(transaction);
      await preparedRows(transaction, 'UPDATE devices SET model = $1 WHERE id = $2', ['Never kept', lab.device.id]);
      await preparedRows(transaction, 'SELECT 1 / $1::int AS x', [0], { thenCommit: true });
    });
    await expect(attempt).rejects.toBeInstanceOf(DatabaseError);
    await expect(attempt).rejects.toThrow(/division by zero/);
    expect(finished(transactions[0])).toBe('rollback');
    expect(await modelOf(lab.device.id)).toBe(before);
  });

  it('a failing first statement ends the transaction cleanly, and the pool keeps serving (more failures than connections)', async () => {
    for (let i = 0; i < 8; i++) {
      // A malformed organization id fails the tenant setup statement itself (written with START TRANSACTION).
      await expect(inTenant(t.sequelize, 'not-a-uuid', async () => 'never', lab.engineer.id)).rejects.toThrow(/invalid input syntax for type uuid/);
      // A handler's error after the setup rolls back as before.
      await expect(inTenant(t.sequelize, lab.lab.id, async (transaction) => preparedRows(transaction, 'SELECT nope FROM devices', []))).rejects.toBeInstanceOf(DatabaseError);
    }
    // The test app's pool has 5 connections; every one is idle and usable again.
    const results = await Promise.all(Array.from({ length: 10 }, () => modelOf(lab.device.id)));
    expect(new Set(results).size).toBe(1);
  });

  it('sends START TRANSACTION with the first statement, and the last statement with its COMMIT, in one socket write each', async () => {
    // Every write to any socket is noted with its socket; the transaction's own are picked out after.
    type Write = { socket: net.Socket; messages: number };
    const writes: Write[] = [];
    const socket = net.Socket.prototype as unknown as Record<'_write' | '_writev', (this: net.Socket, ...args: unknown[]) => void>;
    const original = { write: socket._write, writev: socket._writev };
    socket._write = function (...args) {
      writes.push({ socket: this, messages: 1 });
      return original.write.apply(this, args);
    };
    socket._writev = function (...args) {
      writes.push({ socket: this, messages: (args[0] as unknown[]).length });
      return original.writev.apply(this, args);
    };
    let own: net.Socket | undefined;
    try {
      await inTenant(t.sequelize, lab.lab.id, async (transaction) => {
        own = (transaction as unknown as { connection: { connection: { stream: net.Socket } } }).connection.connection.stream;
        await preparedRows(transaction, 'SELECT model FROM devices WHERE id = $1', [lab.device.id], { thenCommit: true });
      });
    } finally {
      socket._write = original.write;
      socket._writev = original.writev;
    }
    const ownWrites = writes.filter((w) => w.socket === own).map((w) => w.messages);
    // Two writes in all: START TRANSACTION + the tenant setup (Parse, Bind, Describe, Execute, Sync),
    // then the statement + COMMIT. Written one by one they would have taken four.
    expect(ownWrites).toHaveLength(2);
    expect(Math.min(...ownWrites)).toBeGreaterThanOrEqual(2);
  });

  it('refuses a statement written after the COMMIT that thenCommit wrote: it would run outside the transaction', async () => {
    const attempt = inTenant(t.sequelize, lab.lab.id, async (transaction) => {
      const last = preparedRows(transaction, 'SELECT 1 AS one', [], { thenCommit: true });
      try {
        return preparedRows(transaction, 'SELECT 2 AS two', []);
      } finally {
        await last;
      }
    });
    await expect(attempt).rejects.toThrow(/after its transaction's COMMIT/);
    expect(await modelOf(lab.device.id)).toBeTruthy(); // the pool still serves
  });

  it('takes genericPlan only for a named statement that ends its transaction, where the setting cannot outlive it', async () => {
    for (const options of [{ genericPlan: true }, { genericPlan: true, thenCommit: true, unnamed: true }]) {
      await expect(inTenant(t.sequelize, lab.lab.id, (transaction) => preparedRows(transaction, 'SELECT 1 AS one', [], options))).rejects.toThrow(/genericPlan is for a named statement/);
    }
    const rows = await inTenant(t.sequelize, lab.lab.id, (transaction) => preparedRows<{ mode: string }>(transaction, "SELECT current_setting('plan_cache_mode') AS mode", [], { genericPlan: true, thenCommit: true }));
    expect(rows).toEqual([{ mode: 'force_generic_plan' }]);
  });
});
