/** What the simulated issuer answers for a card. */
export type CardOutcome =
  { kind: 'approved' } | { kind: 'declined'; code: string; declineCode?: string; message: string };

type TestCard = { number: string; outcome: CardOutcome };

const declined = (code: string, message: string, declineCode?: string): CardOutcome => ({
  kind: 'declined',
  code,
  declineCode,
  message,
});

/**
 * The test card numbers the stand-in knows, numbers and results as in the payment provider's
 * published test-card list (from memory). Any expiry in the future and any CVC work.
 */
export const TEST_CARDS: readonly TestCard[] = [
  { number: '4242424242424242', outcome: { kind: 'approved' } },
  { number: '5555555555554444', outcome: { kind: 'approved' } },
  {
    number: '4000000000000002',
    outcome: declined('card_declined', 'Your card was declined.', 'generic_decline'),
  },
  {
    number: '4000000000009995',
    outcome: declined('card_declined', 'Your card has insufficient funds.', 'insufficient_funds'),
  },
  {
    number: '4000000000009987',
    outcome: declined('card_declined', 'Your card was declined.', 'lost_card'),
  },
  { number: '4000000000000069', outcome: declined('expired_card', 'Your card has expired.') },
  {
    number: '4000000000000127',
    outcome: declined('incorrect_cvc', "Your card's security code is incorrect."),
  },
  {
    number: '4000000000000119',
    outcome: declined(
      'processing_error',
      'An error occurred while processing your card. Try again in a little bit.',
    ),
  },
];

/** Test PaymentMethod ids accepted by `POST /v1/payment_intents` (same list, from memory). */
export const TEST_PAYMENT_METHODS: Readonly<Record<string, string>> = {
  pm_card_visa: '4242424242424242',
  pm_card_mastercard: '5555555555554444',
  pm_card_chargeDeclined: '4000000000000002',
  pm_card_chargeDeclinedInsufficientFunds: '4000000000009995',
  pm_card_chargeDeclinedExpiredCard: '4000000000000069',
};

/**
 * The simulated issuer's answer for a card number. A number that passes the Luhn check but is
 * not a test card is declined, as test mode does with real cards (code card_declined,
 * decline_code test_mode_live_card, from memory) — no real card is ever "charged" here.
 *
 * @param digits - card number, digits only.
 * @returns the outcome.
 * @example cardOutcome('4000000000000002') // { kind: 'declined', code: 'card_declined', … }
 */
export function cardOutcome(digits: string): CardOutcome {
  const known = TEST_CARDS.find((card) => card.number === digits);
  return (
    known?.outcome ??
    declined(
      'card_declined',
      'Your card was declined. This is a test environment: use a test card.',
      'test_mode_live_card',
    )
  );
}

/**
 * Card brand from the number's leading digits (IIN ranges of ISO/IEC 7812 as the networks
 * publish them: Visa 4, Mastercard 51–55 and 2221–2720, American Express 34/37).
 *
 * @example cardBrand('5555555555554444') === 'mastercard'
 */
export function cardBrand(digits: string): string {
  if (digits.startsWith('4')) return 'visa';
  const two = Number(digits.slice(0, 2));
  const four = Number(digits.slice(0, 4));
  if ((two >= 51 && two <= 55) || (four >= 2221 && four <= 2720)) return 'mastercard';
  if (two === 34 || two === 37) return 'amex';
  return 'unknown';
}
