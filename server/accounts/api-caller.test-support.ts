/** Requests as one signed-in person in one organization, for the API tests of this folder. */
import request from 'supertest';
import type { Express } from 'express';
import { signIn } from '../../test/support/factories';

export type Caller = (method: 'get' | 'post' | 'put' | 'delete', path: string, body?: object) => request.Test;

export async function callerFor(app: Express, person: { email: string }, organizationId: string): Promise<Caller> {
  const { token } = await signIn(app, person.email);
  return (method, path, body) => {
    const r = request(app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', organizationId);
    return body === undefined ? r : r.send(body);
  };
}
