import { readCardForm } from './card-form';

const NOW = new Date(Date.UTC(2026, 5, 15)); // June 2026
const valid = {
  card_number: '4242 4242 4242 4242',
  card_expiry: '06 / 26',
  card_cvc: '123',
  card_name: 'A. Buyer',
};
const read = (body: Record<string, string>, needsEmail = false) =>
  readCardForm(body, { needsEmail, knownEmail: needsEmail ? null : 'known@lab.test', now: NOW });

describe('readCardForm', () => {
  it('accepts a valid card expiring this month and strips spaces from the number', () => {
    const result = read(valid);
    expect(result).toEqual({
      ok: true,
      card: {
        number: '4242424242424242',
        expMonth: 6,
        expYear: 2026,
        name: 'A. Buyer',
        email: 'known@lab.test',
      },
    });
  });

  it.each([
    ['card_expiry', { card_expiry: '05 / 26' }, 'in the past'], // a card is valid through its month
    ['card_expiry', { card_expiry: '13/30' }, 'incomplete'],
    ['card_expiry', { card_expiry: '0630' }, null], // MMYY without separator is fine
    ['card_number', { card_number: '4242' }, 'incomplete'],
    ['card_cvc', { card_cvc: '12' }, 'incomplete'],
    // American Express uses a 4-digit code (network rule); 378282246310005 is its test number.
    ['card_cvc', { card_number: '378282246310005', card_cvc: '123' }, 'incomplete'],
    ['card_cvc', { card_number: '378282246310005', card_cvc: '1234' }, null],
    ['card_name', { card_name: '  ' }, 'name'],
  ])('%s with %j', (field, override, message) => {
    const result = read({ ...valid, ...override });
    if (message === null) {
      expect(result.ok).toBe(true);
    } else {
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.errors[field as keyof typeof result.errors]).toContain(message);
    }
  });

  it('requires a plausible e-mail only when Checkout does not know one', () => {
    expect(read({ ...valid, email: 'nope' }, true).ok).toBe(false);
    const withEmail = read({ ...valid, email: 'buyer@lab.test' }, true);
    expect(withEmail.ok && withEmail.card.email).toBe('buyer@lab.test');
  });
});
