/**
 * The instruments used on a test run: which ones, whether each is still in calibration, and the
 * uncertainty contributions they bring. ISO/IEC 17025:2017 6.4.7 and 6.4.9 (from memory): equipment
 * past its calibration is taken out of service, so a reading taken with it is refused, not stored.
 */
import { Op } from 'sequelize';
import { Instrument, RunInstrument, type TestRun } from '../db/models';
import { conflict, validationFailed } from '../http/problem';
import type { RouteContext } from '../http/route';
import type { InstrumentBudget, InstrumentContribution } from '../../shared/schemas/instruments';
import type { UncertaintyContribution } from '../../shared/uncertainty/uncertainty-contribution';
import { audit } from '../audit/audit';
import { calibrationStatus, todayIso } from './calibration-status';

/**
 * The instruments assigned to a run, by name. The organization is named in the query (not only
 * by row-level security) so the (organization_id, run_id, ...) primary key serves it.
 */
export async function assignedInstruments(run: { id: string; organizationId: string }): Promise<Instrument[]> {
  const links = await RunInstrument.findAll({ where: { organizationId: run.organizationId, runId: run.id }, attributes: ['instrumentId'] });
  if (links.length === 0) return [];
  return Instrument.findAll({ where: { id: { [Op.in]: links.map((l) => l.instrumentId) } }, order: [['name', 'ASC'], ['id', 'ASC']] });
}

/** What the rules read of an instrument on a run (a model instance or a row read as JSON). */
export type RunInstrumentFacts = Pick<Instrument, 'id' | 'name' | 'serialNumber' | 'calibrationDue' | 'certificateRef' | 'contributions'>;

/** "<name> s/n <serial> was due for calibration on <date>" for each instrument past its due date. */
export function overdueMessages(instruments: RunInstrumentFacts[], today: string): string[] {
  return instruments
    .filter((i) => calibrationStatus(i.calibrationDue, today) === 'overdue')
    .map((i) => `${i.name} s/n ${i.serialNumber} was due for calibration on ${i.calibrationDue}`);
}

/** Throw a 409 naming every instrument past its calibration due date; `doing` says what was refused. */
export function refuseOverdue(instruments: RunInstrumentFacts[], today: string, doing: string): void {
  const messages = overdueMessages(instruments, today);
  if (messages.length) throw conflict(`${messages.join('; ')}. ${doing}`, { code: 'calibration-overdue' });
}

/**
 * Each instrument's contributions grouped by the budget they join; names carry the instrument so
 * the stored budget shows where every row came from.
 */
export function contributionsByBudget(instruments: RunInstrumentFacts[]): Partial<Record<InstrumentBudget, UncertaintyContribution[]>> {
  const out: Partial<Record<InstrumentBudget, UncertaintyContribution[]>> = {};
  for (const i of instruments) {
    for (const { budget, ...c } of i.contributions as InstrumentContribution[]) {
      (out[budget] ??= []).push({ ...c, name: `${c.name} (${i.name} s/n ${i.serialNumber})` });
    }
  }
  return out;
}

/** The instruments as a stored result names them: which ones, and their calibration when it was computed. */
export function instrumentsOnRecord(instruments: RunInstrumentFacts[]) {
  return instruments.map((i) => ({ id: i.id, name: i.name, serialNumber: i.serialNumber, calibrationDue: i.calibrationDue, certificateRef: i.certificateRef }));
}

/** An instrument as listed on a run (detail, report): identification and calibration. */
export function presentRunInstrument(i: Instrument, today: string) {
  return {
    id: i.id,
    name: i.name,
    model: i.model,
    serialNumber: i.serialNumber,
    calibratedOn: i.calibratedOn,
    calibrationDue: i.calibrationDue,
    calibrationStatus: calibrationStatus(i.calibrationDue, today),
    certificateRef: i.certificateRef,
  };
}

/** Replace the set of instruments used on a run, while it is on the bench. */
export async function setRunInstruments(ctx: RouteContext, run: TestRun, instrumentIds: string[]): Promise<void> {
  if (run.state !== 'testing') throw conflict(`The instruments can only be changed while the run is on the bench; it is ${run.state}.`, { code: 'run-not-editable' });
  const found = instrumentIds.length ? await Instrument.findAll({ where: { id: { [Op.in]: instrumentIds } } }) : [];
  // Another lab's instrument is invisible here (row-level security), so it reads as unknown.
  const missing = instrumentIds.map((id, index) => ({ id, index })).filter(({ id }) => !found.some((i) => i.id === id));
  if (missing.length) {
    throw validationFailed(`${missing.length} of the instruments ${missing.length === 1 ? 'is' : 'are'} not in your register.`, missing.map(({ index }) => ({ pointer: `/instrumentIds/${index}`, message: 'is not an instrument of your register' })));
  }
  const today = todayIso();
  refuseOverdue(found, today, 'Calibrate it, or use another instrument, before using it on a run.');
  const before = (await assignedInstruments(run)).map((i) => presentRunInstrument(i, today));
  await RunInstrument.destroy({ where: { organizationId: run.organizationId, runId: run.id } });
  await RunInstrument.bulkCreate(instrumentIds.map((instrumentId) => ({ organizationId: run.organizationId, runId: run.id, instrumentId, assignedBy: ctx.principal?.userId ?? null })));
  await audit(ctx, { action: 'set-instruments', entity: 'test-run', entityId: run.id, before: { instruments: before }, after: { instruments: found.map((i) => presentRunInstrument(i, today)) } });
}
