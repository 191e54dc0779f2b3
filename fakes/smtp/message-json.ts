import { addressesOf, type StoredMessage } from './stored-message';

/** One attachment as listed by the JSON API; `url` downloads the exact bytes. */
export type AttachmentJson = {
  filename: string | null;
  contentType: string;
  size: number;
  contentId: string | null;
  url: string;
};

/** A message as the JSON API returns it. */
export type MessageJson = {
  id: string;
  receivedAt: string;
  envelope: StoredMessage['envelope'];
  messageId: string | null;
  /** Address of the From header (lower case), null when absent. */
  from: string | null;
  to: string[];
  cc: string[];
  subject: string;
  /** ISO 8601 from the Date header, the receive time when the header is missing. */
  date: string;
  text: string | null;
  html: string | null;
  attachments: AttachmentJson[];
  rawUrl: string;
};

/** The detail view adds every header line, unfolded (RFC 5322 §2.2.3), in source order. */
export type MessageDetailJson = MessageJson & { headers: Array<{ name: string; value: string }> };

/**
 * Presents a stored message as plain JSON for the inbox API.
 *
 * @param message - a stored message.
 * @param origin - scheme, host and port the client used (e.g. 'http://127.0.0.1:1080'), so the
 *   attachment and raw URLs can be fetched as they are.
 * @returns plain data, no Buffers or Maps.
 * @example toMessageJson(message, 'http://127.0.0.1:1080').attachments[0].url
 *   // 'http://127.0.0.1:1080/api/messages/1767225600000-0a1b2c3d/attachments/0'
 */
export function toMessageJson(message: StoredMessage, origin: string): MessageJson {
  const { parsed } = message;
  const base = `${origin}/api/messages/${message.id}`;
  return {
    id: message.id,
    receivedAt: message.receivedAt,
    envelope: message.envelope,
    messageId: parsed.messageId ?? null,
    from: addressesOf(parsed.from)[0] ?? null,
    to: addressesOf(parsed.to),
    cc: addressesOf(parsed.cc),
    subject: parsed.subject ?? '',
    date: (parsed.date ?? new Date(message.receivedAt)).toISOString(),
    text: parsed.text ?? null,
    html: parsed.html || null,
    attachments: parsed.attachments.map((attachment, index) => ({
      filename: attachment.filename ?? null,
      contentType: attachment.contentType,
      size: attachment.content.length,
      contentId: attachment.contentId ?? null,
      url: `${base}/attachments/${index}`,
    })),
    rawUrl: `${base}/raw`,
  };
}

/**
 * Presents a message with its header lines as well (for the detail endpoint and page).
 *
 * @param message - a stored message.
 * @param origin - as for {@link toMessageJson}.
 * @returns the summary plus `headers`, folding whitespace collapsed to one space.
 * @example toMessageDetailJson(message, origin).headers[0] // { name: 'Content-Type', value: '…' }
 */
export function toMessageDetailJson(message: StoredMessage, origin: string): MessageDetailJson {
  const headers = message.parsed.headerLines.map(({ line }) => {
    const colon = line.indexOf(':');
    return {
      name: colon < 0 ? line : line.slice(0, colon).trim(),
      value:
        colon < 0
          ? ''
          : line
              .slice(colon + 1)
              .replace(/\r?\n[ \t]+/g, ' ')
              .trim(),
    };
  });
  return { ...toMessageJson(message, origin), headers };
}
