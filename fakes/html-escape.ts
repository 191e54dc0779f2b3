/**
 * Escapes text for use inside HTML element content and double-quoted attribute values.
 *
 * Replaces the five characters with meaning in HTML (`& < > " '`) by character references, as the
 * HTML Living Standard's serialisation rules do for text and attributes.
 *
 * @param text - any string; non-strings are not accepted (strict typing).
 * @returns the escaped string, safe to concatenate into markup.
 * @example escapeHtml('<b>"R&S"</b>') === '&lt;b&gt;&quot;R&amp;S&quot;&lt;/b&gt;'
 */
export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}
