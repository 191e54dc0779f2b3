/**
 * The daily calibration check: for each lab, the instruments whose calibration falls due within
 * CALIBRATION_DUE_SOON_DAYS or is overdue, mailed to the lab's administrators once per instrument
 * and due date. What was mailed is recorded in `calibration_notices` (migration 0008) in the same
 * transaction as the mail jobs, so a repeated or concurrent check mails nothing twice (the UNIQUE
 * key makes a second inserter wait and then skip), and a failed one mails nothing.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { inTenant } from '../tenancy/tenant-transaction';
import { peopleWithRole } from '../mail/people-with-role';
import type { MailEnqueuer } from '../billing/billing-deps';
import { addDaysIso, CALIBRATION_DUE_SOON_DAYS, todayIso } from './calibration-status';
import { calibrationDueEmail } from '../../templates/email/calibration-due';

export interface CalibrationNoticeDeps {
  sequelize: Sequelize;
  /** Base of links in e-mails, e.g. https://sidecheck.example (no trailing slash). */
  publicUrl: string;
  enqueueMail: MailEnqueuer;
}

export interface CalibrationCheckOutcome {
  /** Instruments newly noticed, over all labs. */
  instruments: number;
  /** E-mails enqueued (one per administrator of a lab with newly noticed instruments). */
  mails: number;
}

/**
 * Run the check for every lab as of `today` (UTC, YYYY-MM-DD): instruments with calibration_due ≤
 * today + 30 days (overdue when before today) that have no notice for that due date yet get one,
 * and each lab administrator gets one e-mail listing them. A lab without administrators is skipped
 * and noticed later, once it has one. Each lab runs in its own tenant transaction.
 * @example await checkCalibrationDue(deps, '2026-12-05') // { instruments: 2, mails: 1 }
 */
export async function checkCalibrationDue(deps: CalibrationNoticeDeps, today: string = todayIso()): Promise<CalibrationCheckOutcome> {
  const horizon = addDaysIso(today, CALIBRATION_DUE_SOON_DAYS);
  // Organizations carry no row-level security: listing the labs needs no tenant scope.
  const labs = await deps.sequelize.query<{ id: string; name: string }>("SELECT id, name FROM organizations WHERE kind = 'lab' ORDER BY created_at", { type: QueryTypes.SELECT });
  const outcome: CalibrationCheckOutcome = { instruments: 0, mails: 0 };
  for (const lab of labs) {
    await inTenant(deps.sequelize, lab.id, async (transaction) => {
      const admins = await peopleWithRole(deps.sequelize, lab.id, ['lab-admin'], transaction);
      if (!admins.length) return;
      const noticed = await deps.sequelize.query<{ name: string; model: string; serialNumber: string; calibrationDue: string }>(
        `WITH inserted AS (
           INSERT INTO calibration_notices (organization_id, instrument_id, calibration_due, recipients)
           SELECT i.organization_id, i.id, i.calibration_due, :recipients FROM instruments i
            WHERE i.organization_id = :org AND i.calibration_due <= :horizon
           ON CONFLICT (organization_id, instrument_id, calibration_due) DO NOTHING
           RETURNING instrument_id)
         SELECT i.name, i.model, i.serial_number AS "serialNumber", to_char(i.calibration_due, 'YYYY-MM-DD') AS "calibrationDue"
           FROM instruments i JOIN inserted n ON n.instrument_id = i.id
          ORDER BY i.calibration_due, i.name`,
        { replacements: { org: lab.id, horizon, recipients: admins.length }, type: QueryTypes.SELECT, transaction },
      );
      if (!noticed.length) return;
      const instruments = noticed.map((i) => ({ ...i, overdue: i.calibrationDue < today }));
      for (const admin of admins) {
        const mail = calibrationDueEmail({ adminName: admin.displayName, labName: lab.name, instruments, equipmentUrl: `${deps.publicUrl}/equipment` });
        await deps.enqueueMail(transaction, { to: admin.email, ...mail });
      }
      outcome.instruments += noticed.length;
      outcome.mails += admins.length;
    });
  }
  return outcome;
}
