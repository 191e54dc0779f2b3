import type { CardInput } from './card-payment';
import type { FormBody } from './form-params';
import { isPlausibleEmail } from './form-params';
import { isLuhnValid } from './luhn-check';
import { cardBrand } from './test-cards';

/** The hosted page's form fields as typed (strings, kept for re-display). */
export type CardFormValues = {
  email: string;
  card_number: string;
  card_expiry: string;
  card_cvc: string;
  card_name: string;
};

/** Either a card ready to charge, or a message per invalid field. */
export type CardFormResult =
  | { ok: true; card: CardInput }
  | { ok: false; values: CardFormValues; errors: Partial<Record<keyof CardFormValues, string>> };

/**
 * Reads and checks the card form of the hosted payment page before anything is charged, the way
 * a payment form validates on the client: number of 12–19 digits passing the Luhn check
 * (ISO/IEC 7812-1), expiry MM/YY or MM/YYYY not before the current month, CVC of 3 digits
 * (4 for American Express), the cardholder name, and an e-mail when Checkout does not know one.
 *
 * @param body - the posted form.
 * @param options.needsEmail - whether the e-mail field is shown and required.
 * @param options.knownEmail - the e-mail Checkout already has, used when the field is not shown.
 * @param options.now - the current time (month granularity, UTC).
 * @returns the card or the field errors.
 * @example readCardForm({ card_number: '4242 4242 4242 4242', card_expiry: '12/34', card_cvc: '123',
 *   card_name: 'A B' }, { needsEmail: false, knownEmail: 'a@b.test', now: new Date() }).ok === true
 */
export function readCardForm(
  body: FormBody,
  options: { needsEmail: boolean; knownEmail: string | null; now: Date },
): CardFormResult {
  const text = (key: keyof CardFormValues) =>
    typeof body[key] === 'string' ? (body[key] as string).trim() : '';
  const values: CardFormValues = {
    email: text('email'),
    card_number: text('card_number'),
    card_expiry: text('card_expiry'),
    card_cvc: text('card_cvc'),
    card_name: text('card_name'),
  };
  const errors: Partial<Record<keyof CardFormValues, string>> = {};

  const number = values.card_number.replace(/[\s-]/g, '');
  if (!/^[0-9]{12,19}$/.test(number)) errors.card_number = 'Your card number is incomplete.';
  else if (!isLuhnValid(number)) errors.card_number = 'Your card number is invalid.';

  const expiry = /^([0-9]{1,2})\s*\/?\s*([0-9]{2}|[0-9]{4})$/.exec(values.card_expiry);
  const expMonth = expiry ? Number(expiry[1]) : 0;
  const expYear = expiry
    ? expiry[2].length === 2
      ? 2000 + Number(expiry[2])
      : Number(expiry[2])
    : 0;
  if (!expiry || expMonth < 1 || expMonth > 12) {
    errors.card_expiry = "Your card's expiration date is incomplete.";
  } else if (
    expYear * 12 + expMonth <
    options.now.getUTCFullYear() * 12 + options.now.getUTCMonth() + 1
  ) {
    errors.card_expiry = "Your card's expiration date is in the past.";
  }

  const cvcLength = cardBrand(number) === 'amex' ? 4 : 3;
  if (!new RegExp(`^[0-9]{${cvcLength}}$`).test(values.card_cvc))
    errors.card_cvc = "Your card's security code is incomplete.";
  if (!values.card_name) errors.card_name = 'Enter the name on the card.';
  if (options.needsEmail && !isPlausibleEmail(values.email))
    errors.email = 'Enter a valid email address.';

  if (Object.keys(errors).length) return { ok: false, values, errors };
  return {
    ok: true,
    card: {
      number,
      expMonth,
      expYear,
      name: values.card_name,
      email: options.needsEmail ? values.email : options.knownEmail,
    },
  };
}
