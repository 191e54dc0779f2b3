// Test support for the lab-records specs: a signed-in caller in a lab, and invented instrument
// records with calibration dates relative to today.
import request from 'supertest';
import type { Express } from 'express';
import { signIn } from '../../test/support/factories';
import type { InstrumentBody } from '../../shared/schemas/instruments';
import { addDaysIso, todayIso } from './calibration-status';

export type Caller = (method: 'get' | 'post' | 'put', path: string, body?: object) => request.Test;

/** Requests to /api as `user`, with `organizationId` as the active organization. */
export async function callerFor(app: Express, user: { email: string }, organizationId: string, password?: string): Promise<Caller> {
  const { token } = await signIn(app, user.email, password);
  return (method, path, body) => {
    const r = request(app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', organizationId);
    return body ? r.send(body) : r;
  };
}

let serial = 0;

/** An invented instrument, calibrated a year before it falls due `dueInDays` from today (negative: overdue). */
export function instrumentBody(dueInDays: number, overrides: Partial<InstrumentBody> = {}): InstrumentBody {
  serial++;
  const due = addDaysIso(todayIso(), dueInDays);
  return {
    name: `Test analyser ${serial}`,
    model: 'Invented SA-100 spectrum analyser',
    serialNumber: `SA-${process.pid}-${serial}-${Date.now() % 100000}`,
    calibratedOn: addDaysIso(due, -365) > todayIso() ? todayIso() : addDaysIso(due, -365),
    calibrationDue: due,
    certificateRef: `CERT-${serial}`,
    contributions: [{ name: 'Relative amplitude, certificate', distribution: 'normal', value: 0.3, coverageFactor: 2, budget: 'relative' }],
    ...overrides,
  };
}
