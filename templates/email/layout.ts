/** The one layout every Sidecheck e-mail shares: a plain-text body and the same content as simple HTML. */
export interface EmailContent {
  subject: string;
  /** Paragraphs of plain text. */
  paragraphs: string[];
  action?: { label: string; url: string };
  footnote?: string;
}

export interface RenderedEmail {
  subject: string;
  text: string;
  html: string;
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function renderEmail(content: EmailContent): RenderedEmail {
  const footer = 'Sent by Sidecheck on behalf of your test laboratory. Replies to this address are not read.';
  const text = [
    ...content.paragraphs,
    ...(content.action ? [`${content.action.label}: ${content.action.url}`] : []),
    ...(content.footnote ? [content.footnote] : []),
    '--',
    footer,
  ].join('\n\n');
  const html = `<!doctype html><html><body style="margin:0;background:#f3f5f5;font-family:Roboto,Arial,sans-serif;color:#1d2a2c">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0"><tr><td align="center" style="padding:24px">
<table role="presentation" width="560" cellpadding="0" cellspacing="0" style="background:#ffffff;border-radius:8px;border-top:4px solid #0d6e6e">
<tr><td style="padding:24px 28px 8px;font-size:13px;letter-spacing:.08em;text-transform:uppercase;color:#0d6e6e">Sidecheck</td></tr>
<tr><td style="padding:0 28px;font-size:20px;font-weight:500">${escape(content.subject)}</td></tr>
${content.paragraphs.map((p) => `<tr><td style="padding:12px 28px 0;font-size:15px;line-height:1.5">${escape(p)}</td></tr>`).join('\n')}
${content.action ? `<tr><td style="padding:20px 28px 4px"><a href="${escape(content.action.url)}" style="display:inline-block;background:#0d6e6e;color:#ffffff;text-decoration:none;padding:10px 18px;border-radius:4px;font-size:15px">${escape(content.action.label)}</a></td></tr>` : ''}
${content.footnote ? `<tr><td style="padding:16px 28px 0;font-size:13px;color:#56686b">${escape(content.footnote)}</td></tr>` : ''}
<tr><td style="padding:24px 28px;font-size:12px;color:#6b7c7f">${escape(footer)}</td></tr>
</table></td></tr></table></body></html>`;
  return { subject: content.subject, text, html };
}
