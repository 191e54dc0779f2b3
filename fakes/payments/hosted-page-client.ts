/** Card fields a buyer types into the hosted page. */
export type HostedPageCard = {
  number: string;
  expiry?: string;
  cvc?: string;
  name?: string;
  email?: string;
};

/** The outcome of one form submission, as a browser would see it (redirects not followed). */
export type HostedPageResult = { status: number; location: string | null; html: string };

/**
 * Drives the hosted payment page with plain HTTP, as a browser without script would: fetches the
 * page, reads the form's action and field names from the HTML, posts the card fields.
 *
 * @param pageUrl - the Checkout Session's `url`.
 * @param card - the card to enter; expiry defaults to 12 / (next year), CVC 123, name 'Test Buyer'.
 * @returns status, Location header and body of the POST's answer.
 * @throws Error when the page has no form or lacks an expected field.
 */
export async function payOnHostedPage(
  pageUrl: string,
  card: HostedPageCard,
): Promise<HostedPageResult> {
  const page = await fetch(pageUrl);
  const html = await page.text();
  const action = /<form[^>]*method="post"[^>]*action="([^"]+)"/.exec(html)?.[1];
  if (page.status !== 200 || !action)
    throw new Error(`payOnHostedPage: no payment form at ${pageUrl} (${page.status})`);
  const fieldNames = [...html.matchAll(/<input[^>]*name="([^"]+)"/g)].map((match) => match[1]);
  const year = String((new Date().getUTCFullYear() + 1) % 100).padStart(2, '0');
  const values: Record<string, string> = {
    email: card.email ?? 'buyer@lab.test',
    card_number: card.number,
    card_expiry: card.expiry ?? `12 / ${year}`,
    card_cvc: card.cvc ?? '123',
    card_name: card.name ?? 'Test Buyer',
  };
  for (const required of ['card_number', 'card_expiry', 'card_cvc', 'card_name']) {
    if (!fieldNames.includes(required))
      throw new Error(`payOnHostedPage: the form has no ${required} field`);
  }
  const form = new URLSearchParams(fieldNames.map((name): [string, string] => [name, values[name] ?? '']));
  const response = await fetch(new URL(action, pageUrl), {
    method: 'POST',
    body: form,
    redirect: 'manual',
  });
  return {
    status: response.status,
    location: response.headers.get('location'),
    html: await response.text(),
  };
}
