/**
 * Sent when an administrator invites someone to join their organization, or when a lab grants an
 * outside auditor read-only access to its issued reports: one single-use link that expires.
 */
import { renderEmail, type RenderedEmail } from './layout';

export type InvitationEmailInput =
  | { kind: 'member'; organizationName: string; inviterName: string; roleLabel: string; acceptUrl: string; expiresOn: string }
  | { kind: 'auditor'; organizationName: string; inviterName: string; scopeText: string; accessUntil: string; note: string | null; acceptUrl: string; expiresOn: string };

/** The invitation e-mail; `expiresOn` is the link's last day (ISO date), shown as written. */
export function invitationEmail(input: InvitationEmailInput): RenderedEmail {
  const footnote = `The link can be used once and works until ${input.expiresOn}. If you did not expect this message, you can ignore it.`;
  if (input.kind === 'member') {
    return renderEmail({
      subject: `You are invited to join ${input.organizationName} on Sidecheck`,
      paragraphs: [
        'Hello,',
        `${input.inviterName} has invited you to join ${input.organizationName} on Sidecheck as ${input.roleLabel}.`,
        'Open the link to accept. If you have no Sidecheck account yet, you will choose your name and a password.',
      ],
      action: { label: 'Accept the invitation', url: input.acceptUrl },
      footnote,
    });
  }
  return renderEmail({
    subject: `${input.organizationName} has given you read-only access to its test reports`,
    paragraphs: [
      'Hello,',
      `${input.inviterName} of ${input.organizationName} has given you read-only access to ${input.scopeText} until ${input.accessUntil}.`,
      ...(input.note ? [`Their note: ${input.note}`] : []),
      'Open the link to accept. If you have no Sidecheck account yet, you will choose your name and a password.',
    ],
    action: { label: 'Accept access', url: input.acceptUrl },
    footnote,
  });
}
