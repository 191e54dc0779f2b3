/**
 * A run ready to issue, made through the API of a running server: the engineer starts a run of
 * the plan, saves one carrier-suppression reading and sends it for review; the reviewer authorizes.
 */
import type { Api } from './product-server';

/**
 * @param plan - the one-case carrier-suppression plan of test/support/factories.ts buildLabScenario.
 * @returns the run's id and number.
 */
export async function approvedRun(engineer: Api, reviewer: Api, planId: string): Promise<{ id: string; number: string }> {
  const run = await engineer<{ id: string; number: string; testCases: { id: string }[] }>('POST', '/runs', { planId });
  if (run.status !== 201) throw new Error(`POST /runs: ${run.status} ${run.bytes.toString()}`);
  // 51 dBm PEP, 8.2 dBm carrier: 42.8 dB suppression against "at least 40 dB" (47 CFR 80.207(c)), a pass.
  const steps: [Api, string, string, unknown?][] = [
    [engineer, 'PUT', `/runs/${run.body.id}/cases/${run.body.testCases[0].id}/reading`, { values: { pepDbm: 51, carrierDbm: 8.2 } }],
    [engineer, 'POST', `/runs/${run.body.id}/submit`],
    [reviewer, 'POST', `/runs/${run.body.id}/approve`],
  ];
  for (const [who, method, url, body] of steps) {
    const res = await who(method, url, body);
    if (res.status >= 300) throw new Error(`${method} ${url}: ${res.status} ${res.bytes.toString()}`);
  }
  return { id: run.body.id, number: run.body.number };
}
