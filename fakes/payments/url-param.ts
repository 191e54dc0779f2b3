import { invalidParam } from './api-error';
import { optionalString, type FormBody } from './form-params';

/**
 * Reads an http(s) URL parameter such as `success_url`; the `{CHECKOUT_SESSION_ID}` template
 * the API substitutes on redirect is allowed anywhere in it.
 *
 * @param body - the parameters.
 * @param key - the parameter name.
 * @returns the URL as sent, or null when absent or empty.
 * @throws ApiError 400 (code url_invalid) for anything that is not an absolute http(s) URL.
 * @example readUrl({ success_url: 'https://lab.test/ok?s={CHECKOUT_SESSION_ID}' }, 'success_url')
 */
export function readUrl(body: FormBody, key: string): string | null {
  const value = optionalString(body, key);
  if (!value) return null;
  try {
    const url = new URL(value.replaceAll('{CHECKOUT_SESSION_ID}', 'cs_placeholder'));
    if (url.protocol === 'http:' || url.protocol === 'https:') return value;
  } catch {
    // falls through to the error below
  }
  throw invalidParam(key, `Not a valid URL: ${value}`, 'url_invalid');
}
