import type { Response } from 'express';
import type { CheckoutSession } from './checkout-objects';
import { expireDueSessions } from './checkout-session-lifecycle';
import { renderStatusPage } from './hosted-page-html';
import type { PaymentsContext } from './payments-context';

/** The open session, or undefined after answering with the page for a missing/expired/paid one. */
export function sessionOrStatusPage(
  context: PaymentsContext,
  id: string,
  response: Response,
): CheckoutSession | undefined {
  expireDueSessions(context);
  const session = context.store.state.checkoutSessions[id];
  if (!session) {
    sendHostedPage(
      response,
      404,
      renderStatusPage('Payment page not found', 'There is no payment with this link.', null),
    );
  } else if (session.status === 'expired') {
    const link = session.cancel_url
      ? { href: session.cancel_url, label: 'Return to the shop' }
      : null;
    sendHostedPage(
      response,
      410,
      renderStatusPage('Payment page expired', 'This payment link has expired.', link),
    );
  } else if (session.status === 'complete') {
    sendPaid(response, session);
  } else {
    return session;
  }
  return undefined;
}

/**
 * Answers for a paid session: 303 to its success_url with `{CHECKOUT_SESSION_ID}` replaced, as
 * Checkout redirects, or our own confirmation page when the session has no success_url.
 */
export function sendPaid(response: Response, session: CheckoutSession): void {
  if (session.success_url) {
    response.redirect(303, session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id));
    return;
  }
  sendHostedPage(
    response,
    200,
    renderStatusPage('Payment received', 'Thank you, your payment is complete.', null),
  );
}

/**
 * Sends a page with a CSP that allows nothing but our style sheet and posting the form to
 * ourselves; the success URL's origin is listed in form-action because browsers apply that
 * directive to the redirect after the POST as well.
 */
export function sendHostedPage(
  response: Response,
  status: number,
  html: string,
  session?: CheckoutSession,
): void {
  let formTargets = "'self'";
  if (session?.success_url) {
    try {
      formTargets += ` ${new URL(session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', 'x')).origin}`;
    } catch {
      // validated at creation; an unparsable URL only loses the extra origin
    }
  }
  response
    .status(status)
    .set(
      'Content-Security-Policy',
      `default-src 'none'; style-src 'self'; form-action ${formTargets}; base-uri 'none'; frame-ancestors 'none'`,
    )
    .set('Cache-Control', 'no-store')
    .set('X-Content-Type-Options', 'nosniff')
    .type('html')
    .send(html);
}
