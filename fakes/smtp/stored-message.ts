import type { AddressObject, ParsedMail } from 'mailparser';

/** SMTP envelope of one received message: what MAIL FROM and RCPT TO said, not the headers. */
export type MessageEnvelope = {
  /** MAIL FROM address, '' for the null sender (RFC 5321 §4.5.5 bounces). */
  mailFrom: string;
  /** Every RCPT TO address, in the order given (includes Bcc recipients). */
  rcptTo: string[];
  /** User name the client logged in with (any password is accepted), null when it did not. */
  authUser: string | null;
};

/** One received message as kept by the stand-in: the exact bytes plus their parse. */
export type StoredMessage = {
  /** Sortable id: 13-digit receive time in ms, '-', 8 hex digits. */
  id: string;
  /** ISO 8601 UTC time the DATA phase ended. */
  receivedAt: string;
  envelope: MessageEnvelope;
  /** The RFC 5322 source exactly as received (dot-unstuffed by smtp-server). */
  raw: Buffer;
  parsed: ParsedMail;
};

/** Shape of an id, checked before any id from a URL is used. */
export const MESSAGE_ID_PATTERN = /^[0-9]{13}-[0-9a-f]{8}$/;

/**
 * Flattens a mailparser address header (one object or several, groups expanded) to bare
 * addresses, lower-cased because the domain part is case-insensitive (RFC 5321 §2.4) and local
 * parts are matched case-insensitively by almost every mailbox provider (common practice).
 *
 * @param header - `parsed.to`, `parsed.cc`, `parsed.from`…, or undefined when absent.
 * @returns the addresses in header order; [] when the header is absent.
 * @example addressesOf(parsed.to) // ['lab@example.test']
 */
export function addressesOf(header: AddressObject | AddressObject[] | undefined): string[] {
  if (header === undefined) return [];
  const objects = Array.isArray(header) ? header : [header];
  const result: string[] = [];
  for (const entry of objects.flatMap((object) => object.value)) {
    const members = entry.group ?? [entry];
    for (const member of members) {
      if (member.address) result.push(member.address.toLowerCase());
    }
  }
  return result;
}

/**
 * Tells whether a message was addressed to a mailbox, by envelope (covers Bcc) or To/Cc header.
 *
 * @param message - a stored message.
 * @param address - mailbox to look for, compared case-insensitively.
 * @returns true when any envelope recipient or To/Cc address equals `address`.
 * @example isAddressedTo(message, 'Lab@Example.test') // true for rcptTo ['lab@example.test']
 */
export function isAddressedTo(message: StoredMessage, address: string): boolean {
  const wanted = address.trim().toLowerCase();
  const recipients = [
    ...message.envelope.rcptTo.map((rcpt) => rcpt.toLowerCase()),
    ...addressesOf(message.parsed.to),
    ...addressesOf(message.parsed.cc),
  ];
  return recipients.includes(wanted);
}
