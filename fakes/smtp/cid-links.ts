import type { Attachment } from 'mailparser';

/**
 * Points `cid:` references of an HTML body (RFC 2392 content-id URLs) at the attachment download
 * URLs, so inline images show in the inbox preview. Unknown content ids are left unchanged.
 *
 * @param html - the HTML body as sent.
 * @param attachments - the parsed attachments, in the order the API numbers them.
 * @param attachmentUrl - builds the URL for the attachment at an index.
 * @returns the HTML with each known `cid:<id>` replaced.
 * @example replaceCidLinks('<img src="cid:logo@x">', [logo], (i) => `/a/${i}`) === '<img src="/a/0">'
 */
export function replaceCidLinks(
  html: string,
  attachments: readonly Attachment[],
  attachmentUrl: (index: number) => string,
): string {
  return html.replace(/cid:([^"'\s)>]+)/gi, (whole, contentId: string) => {
    const wanted = decodeContentId(contentId);
    const index = attachments.findIndex(
      (attachment) => attachment.contentId?.replace(/^<|>$/g, '') === wanted,
    );
    return index < 0 ? whole : attachmentUrl(index);
  });
}

/** RFC 2392 %-encodes the content id inside the URL; a malformed escape is taken literally. */
function decodeContentId(encoded: string): string {
  try {
    return decodeURIComponent(encoded);
  } catch {
    return encoded;
  }
}
