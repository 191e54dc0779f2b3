import { randomBytes } from 'node:crypto';
import { mkdir, readFile, readdir, rename, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import {
  isAddressedTo,
  MESSAGE_ID_PATTERN,
  type MessageEnvelope,
  type StoredMessage,
} from './stored-message';

/** What is written beside each `<id>.eml`; its presence marks a completely stored message. */
type MessageMeta = { id: string; receivedAt: string; envelope: MessageEnvelope };

/**
 * Received messages, kept in memory for queries and on disk so they survive a restart.
 *
 * Layout of `dataDir`: `<id>.eml` (raw source) and `<id>.json` (envelope and time). Each file is
 * written to a temporary name and renamed, so a crash leaves either the whole message or none.
 * The parse is redone with mailparser's `simpleParser` on load; `keepCidLinks` keeps the HTML
 * exactly as sent (the inbox page rewrites `cid:` links for display only).
 */
export class MessageStore {
  private constructor(
    private readonly dataDir: string,
    private messages: StoredMessage[],
  ) {}

  /**
   * Opens (creating if needed) a message folder and loads every complete message in it.
   * @throws when the folder cannot be created or a stored message cannot be read.
   */
  static async open(dataDir: string): Promise<MessageStore> {
    await mkdir(dataDir, { recursive: true });
    const names = await readdir(dataDir);
    const messages: StoredMessage[] = [];
    for (const name of names.filter((entry) => entry.endsWith('.json'))) {
      const meta = JSON.parse(await readFile(join(dataDir, name), 'utf8')) as MessageMeta;
      if (!MESSAGE_ID_PATTERN.test(meta.id)) continue;
      const raw = await readFile(join(dataDir, `${meta.id}.eml`));
      messages.push({ ...meta, raw, parsed: await simpleParser(raw, { keepCidLinks: true }) });
    }
    messages.sort((a, b) => a.id.localeCompare(b.id));
    return new MessageStore(dataDir, messages);
  }

  /** Stores one message (disk first, then memory) and returns it with its new id. */
  async add(raw: Buffer, envelope: MessageEnvelope): Promise<StoredMessage> {
    const now = new Date();
    const id = `${String(now.getTime()).padStart(13, '0')}-${randomBytes(4).toString('hex')}`;
    const meta: MessageMeta = { id, receivedAt: now.toISOString(), envelope };
    const parsed = await simpleParser(raw, { keepCidLinks: true });
    await this.writeAtomically(`${id}.eml`, raw);
    await this.writeAtomically(`${id}.json`, JSON.stringify(meta, null, 2));
    const message: StoredMessage = { ...meta, raw, parsed };
    this.messages.push(message);
    return message;
  }

  /** Messages newest first, optionally only those addressed to `to` (envelope, To or Cc). */
  list(filter: { to?: string } = {}): StoredMessage[] {
    const { to } = filter;
    const selected = to
      ? this.messages.filter((message) => isAddressedTo(message, to))
      : this.messages;
    return [...selected].reverse();
  }

  /** One message by id, undefined when unknown or malformed. */
  get(id: string): StoredMessage | undefined {
    return this.messages.find((message) => message.id === id);
  }

  /** Deletes one message from memory and disk; false when there was no such message. */
  async remove(id: string): Promise<boolean> {
    const message = this.get(id);
    if (!message) return false;
    this.messages = this.messages.filter((entry) => entry !== message);
    // The marker goes first so a crash in between never leaves a half-visible message.
    await rm(join(this.dataDir, `${id}.json`), { force: true });
    await rm(join(this.dataDir, `${id}.eml`), { force: true });
    return true;
  }

  /** Deletes every message from memory and disk. */
  async clear(): Promise<void> {
    for (const message of [...this.messages]) await this.remove(message.id);
  }

  private async writeAtomically(name: string, content: Buffer | string): Promise<void> {
    const target = join(this.dataDir, name);
    const temporary = `${target}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`;
    await writeFile(temporary, content);
    await rename(temporary, target);
  }
}
