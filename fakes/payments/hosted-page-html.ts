import { escapeHtml } from '../html-escape';
import type { CheckoutSession, LineItem } from './checkout-objects';
import type { CardFormValues } from './card-form';
import { formatMinorAmount } from './money-format';

/** What the payment form shows besides the session: typed values, field errors, a decline. */
export type PaymentFormState = {
  values: Partial<CardFormValues>;
  errors: Partial<Record<keyof CardFormValues, string>>;
  declineMessage: string | null;
  needsEmail: boolean;
};

/**
 * The hosted payment page of an open session: the order (line items, total) and a plain card
 * form that posts back to the same URL. No script, one same-origin style sheet.
 *
 * @param session - the open session.
 * @param items - its line items.
 * @param form - values, errors and decline message to show (all empty on first load).
 * @returns the complete HTML document.
 * @example renderPaymentPage(session, items, { values: {}, errors: {}, declineMessage: null, needsEmail: false })
 */
export function renderPaymentPage(
  session: CheckoutSession,
  items: readonly LineItem[],
  form: PaymentFormState,
): string {
  const money = (amount: number) => escapeHtml(formatMinorAmount(amount, session.currency));
  const lines = items
    .map(
      (item) =>
        `<li><span>${escapeHtml(item.description)}<br><span class="quantity">Qty ${item.quantity} × ${money(
          item.price.unit_amount,
        )}</span></span><span>${money(item.amount_total)}</span></li>`,
    )
    .join('');
  const field = (name: keyof CardFormValues, label: string, attributes: string) => {
    const error = form.errors[name];
    const value = name === 'card_cvc' ? '' : (form.values[name] ?? '');
    return `<label>${label}<input name="${name}" value="${escapeHtml(value)}" ${attributes} required${
      error ? ` aria-invalid="true" aria-describedby="${name}-error"` : ''
    }>${
      error ? `<span class="field-error" id="${name}-error">${escapeHtml(error)}</span>` : ''
    }</label>`;
  };
  const decline = form.declineMessage
    ? `<p class="decline" role="alert">${escapeHtml(form.declineMessage)}</p>`
    : '';
  const cancel = session.cancel_url
    ? `<a class="cancel" href="${escapeHtml(session.cancel_url)}">← Cancel and return</a>`
    : '';
  return document(
    `Pay ${formatMinorAmount(session.amount_total, session.currency)}`,
    `<main class="checkout">
<section class="summary"><span class="badge">Test mode</span><h2>Total due</h2>
<p class="total">${money(session.amount_total)}</p><ul class="items">${lines}</ul></section>
<section class="pay"><h1>Pay with card</h1>${decline}
<form method="post" action="/pay/${escapeHtml(session.id)}">
${form.needsEmail ? field('email', 'Email', 'type="email" autocomplete="email"') : ''}
${field('card_number', 'Card number', 'inputmode="numeric" autocomplete="cc-number" placeholder="1234 1234 1234 1234"')}
<div class="row">${field('card_expiry', 'Expiry (MM / YY)', 'autocomplete="cc-exp" placeholder="MM / YY"')}
${field('card_cvc', 'CVC', 'inputmode="numeric" autocomplete="cc-csc" placeholder="123"')}</div>
${field('card_name', 'Name on card', 'autocomplete="cc-name"')}
<button type="submit">Pay ${money(session.amount_total)}</button></form>${cancel}
<p class="hint">Local payment stand-in. Test cards: 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is
declined; any future expiry and any CVC.</p></section></main>`,
  );
}

/**
 * A one-message page (paid, expired, not found), optionally with one link.
 * @example renderStatusPage('Expired', 'This payment page has expired.', null)
 */
export function renderStatusPage(
  title: string,
  message: string,
  link: { href: string; label: string } | null,
): string {
  const anchor = link
    ? `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`
    : '';
  return document(
    title,
    `<main class="status"><h1>${escapeHtml(title)}</h1><p>${escapeHtml(message)}</p>${anchor}</main>`,
  );
}

function document(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1"><meta name="referrer" content="no-referrer">
<title>${escapeHtml(title)}</title><link rel="stylesheet" href="/pay/assets/checkout.css"></head>
<body>${body}</body></html>`;
}
