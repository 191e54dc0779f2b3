import Stripe from 'stripe';
import { startPaymentsFixture, type PaymentsFixture } from './payments-fixture';

// Behaviour expected from the payment API's public reference (from memory), exercised through the
// official SDK only.
describe('customers through the SDK', () => {
  let fixture: PaymentsFixture;
  beforeEach(async () => (fixture = await startPaymentsFixture()));
  afterEach(() => fixture.close());

  it('creates and retrieves a customer with the documented shape', async () => {
    const created = await fixture.stripe.customers.create({
      email: 'billing@lab.test',
      name: 'Example RF Lab GmbH',
      metadata: { tenant: 'lab-42' },
      address: { country: 'DE', city: 'Bremen' },
    });
    expect(created.id).toMatch(/^cus_[0-9A-Za-z]+$/);
    expect(created).toMatchObject({
      object: 'customer',
      livemode: false,
      email: 'billing@lab.test',
      metadata: { tenant: 'lab-42' },
      address: { country: 'DE', city: 'Bremen', line1: null },
    });
    expect(Math.abs(created.created - Date.now() / 1000)).toBeLessThan(5);
    const retrieved = await fixture.stripe.customers.retrieve(created.id);
    expect(retrieved).toEqual(created);
  });

  it('updates fields, merges metadata and unsets with empty strings', async () => {
    const customer = await fixture.stripe.customers.create({
      name: 'A',
      phone: '+49 421 1',
      metadata: { a: '1', b: '2' },
    });
    const updated = await fixture.stripe.customers.update(customer.id, {
      name: 'B',
      phone: '',
      metadata: { b: '', c: '3' },
    });
    // Documented: metadata keys are merged, a key set to '' is removed; '' unsets a field.
    expect(updated).toMatchObject({ name: 'B', phone: null, metadata: { a: '1', c: '3' } });
    const cleared = await fixture.stripe.customers.update(customer.id, { metadata: '' });
    expect(cleared.metadata).toEqual({});
    const events = await fixture.stripe.events.list({ type: 'customer.updated' });
    expect(events.data[1].data.previous_attributes).toMatchObject({
      name: 'A',
      phone: '+49 421 1',
    });
  });

  it('lists newest first, filters by exact email and pages with the SDK auto-pagination', async () => {
    const ids: string[] = [];
    for (let index = 0; index < 7; index++) {
      ids.push(
        (
          await fixture.stripe.customers.create({
            email: index % 2 ? 'odd@lab.test' : `c${index}@lab.test`,
          })
        ).id,
      );
    }
    const firstPage = await fixture.stripe.customers.list({ limit: 3 });
    expect(firstPage.data.map((c) => c.id)).toEqual(ids.slice().reverse().slice(0, 3));
    expect(firstPage.has_more).toBe(true);
    expect(firstPage.url).toBe('/v1/customers');

    const all: string[] = [];
    for await (const customer of fixture.stripe.customers.list({ limit: 2 })) all.push(customer.id);
    expect(all).toEqual(ids.slice().reverse());

    const odd = await fixture.stripe.customers.list({ email: 'odd@lab.test' });
    expect(odd.data).toHaveLength(3);
    // The email filter is documented as case-sensitive.
    expect((await fixture.stripe.customers.list({ email: 'ODD@lab.test' })).data).toHaveLength(0);

    const before = await fixture.stripe.customers.list({ ending_before: ids[3], limit: 2 });
    expect(before.data.map((c) => c.id)).toEqual([ids[5], ids[4]]);
  });

  it('deletes a customer and then answers 404 resource_missing', async () => {
    const customer = await fixture.stripe.customers.create({ email: 'gone@lab.test' });
    const deleted = await fixture.stripe.customers.del(customer.id);
    expect(deleted).toMatchObject({ id: customer.id, deleted: true });
    await expect(fixture.stripe.customers.retrieve(customer.id)).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
  });

  it('rejects unknown parameters and bad e-mails with 400 naming the parameter', async () => {
    const unknown = fixture.stripe.customers.create({
      emial: 'typo@lab.test',
    } as Stripe.CustomerCreateParams);
    await expect(unknown).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(unknown).rejects.toMatchObject({ statusCode: 400, param: 'emial' });
    await expect(fixture.stripe.customers.create({ email: 'not-an-email' })).rejects.toMatchObject({
      statusCode: 400,
      param: 'email',
    });
  });
});
