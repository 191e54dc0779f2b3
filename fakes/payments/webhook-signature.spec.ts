import { createHmac } from 'node:crypto';
import Stripe from 'stripe';
import { signatureHeader } from './webhook-signature';

describe('signatureHeader', () => {
  const payload = JSON.stringify({ id: 'evt_1', object: 'event' }, null, 2);
  const secret = 'whsec_spec_secret';

  it('equals the SDK test helper for the same payload, secret and time', () => {
    // stripe-node's generateTestHeaderString implements the documented scheme independently.
    const sdk = new Stripe('sk_test_x', { telemetry: false });
    const expected = sdk.webhooks.generateTestHeaderString({
      payload,
      secret,
      timestamp: 1_767_225_600,
    });
    expect(signatureHeader(payload, secret, 1_767_225_600)).toBe(expected);
  });

  it('is HMAC-SHA256 over "<t>.<body>" in hex (RFC 2104 via node:crypto)', () => {
    const hex = createHmac('sha256', secret).update(`1700000000.${payload}`).digest('hex');
    expect(signatureHeader(payload, secret, 1_700_000_000)).toBe(`t=1700000000,v1=${hex}`);
  });

  it('throws TypeError for an empty secret or a fractional timestamp', () => {
    expect(() => signatureHeader(payload, '', 1)).toThrow(/^signatureHeader/);
    expect(() => signatureHeader(payload, secret, 1.5)).toThrow(TypeError);
  });
});
