import { escapeHtml } from '../html-escape';
import type { MessageDetailJson, MessageJson } from './message-json';

/**
 * Wraps page content in the inbox layout: one external style sheet, no script at all.
 *
 * @param title - page title (plain text, escaped here).
 * @param body - HTML already escaped by the caller.
 * @param options.refreshSeconds - when set, a meta refresh reloads the page (list view only).
 * @returns a complete HTML document.
 * @example inboxLayout('Inbox', '<p>Empty</p>')
 */
export function inboxLayout(
  title: string,
  body: string,
  options: { refreshSeconds?: number } = {},
): string {
  const refresh = options.refreshSeconds
    ? `<meta http-equiv="refresh" content="${options.refreshSeconds}">`
    : '';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">${refresh}
<title>${escapeHtml(title)}</title><link rel="stylesheet" href="/inbox.css"></head>
<body><header><a href="/">Local inbox</a><span>mail received by the SMTP stand-in</span></header>
<main>${body}</main></body></html>`;
}

/**
 * The message list: newest first, a recipient filter and a delete-all button (plain forms).
 *
 * @param messages - messages to list, already filtered and ordered.
 * @param filterTo - the recipient filter in force, '' for none.
 * @returns the full page.
 * @example renderInboxPage([], '') // contains 'No messages'
 */
export function renderInboxPage(messages: readonly MessageJson[], filterTo: string): string {
  const rows = messages
    .map(
      (message) => `<tr>
<td><a href="/messages/${escapeHtml(message.id)}">${escapeHtml(message.subject || '(no subject)')}</a></td>
<td>${escapeHtml(message.from ?? '')}</td><td>${escapeHtml(message.to.join(', '))}</td>
<td>${escapeHtml(message.receivedAt.replace('T', ' ').slice(0, 19))} UTC</td>
<td>${message.attachments.length || ''}</td></tr>`,
    )
    .join('\n');
  const table = messages.length
    ? `<table><thead><tr><th>Subject</th><th>From</th><th>To</th><th>Received</th><th>Files</th></tr></thead>
<tbody>${rows}</tbody></table>`
    : '<p class="muted">No messages.</p>';
  return inboxLayout(
    'Local inbox',
    `<div class="toolbar">
<form method="get" action="/"><label>Recipient
<input type="email" name="to" value="${escapeHtml(filterTo)}" placeholder="any"></label>
<button type="submit">Filter</button></form>
<form method="post" action="/messages/delete"><button class="danger" type="submit">Delete all</button></form>
<span class="muted">${messages.length} message(s)</span></div>
${table}`,
    { refreshSeconds: 10 },
  );
}

/**
 * One message: envelope and main headers, attachments, text part, the HTML part in a sandboxed
 * iframe loaded from its own URL, and every header line.
 *
 * @param message - the detail JSON of the message.
 * @returns the full page.
 * @example renderMessagePage(detail) // contains '<iframe sandbox'
 */
export function renderMessagePage(message: MessageDetailJson): string {
  const attachments = message.attachments
    .map(
      (attachment, index) =>
        `<li><a href="/api/messages/${escapeHtml(message.id)}/attachments/${index}">${escapeHtml(
          attachment.filename ?? `attachment ${index}`,
        )}</a> <span class="muted">${escapeHtml(attachment.contentType)}, ${attachment.size} bytes</span></li>`,
    )
    .join('');
  const headers = message.headers
    .map(
      (header) =>
        `<tr><th>${escapeHtml(header.name)}</th><td>${escapeHtml(header.value)}</td></tr>`,
    )
    .join('');
  return inboxLayout(
    message.subject || '(no subject)',
    `<p><a href="/">← All messages</a> · <a href="/api/messages/${escapeHtml(message.id)}/raw">Raw source</a></p>
<h1>${escapeHtml(message.subject || '(no subject)')}</h1>
<dl><dt>From</dt><dd>${escapeHtml(message.from ?? '')}</dd>
<dt>To</dt><dd>${escapeHtml(message.to.join(', '))}</dd>
<dt>Cc</dt><dd>${escapeHtml(message.cc.join(', '))}</dd>
<dt>Date</dt><dd>${escapeHtml(message.date)}</dd>
<dt>Envelope</dt><dd>${escapeHtml(message.envelope.mailFrom || '<>')} → ${escapeHtml(message.envelope.rcptTo.join(', '))}</dd></dl>
${attachments ? `<section><h2>Attachments</h2><ul>${attachments}</ul></section>` : ''}
${message.html !== null ? `<section><h2>HTML</h2><iframe sandbox src="/messages/${escapeHtml(message.id)}/html" title="HTML body"></iframe></section>` : ''}
${message.text !== null ? `<section><h2>Text</h2><pre>${escapeHtml(message.text)}</pre></section>` : ''}
<section><h2>Headers</h2><table>${headers}</table></section>`,
  );
}
