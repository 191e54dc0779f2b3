/** Sent when someone asks to reset the password of an existing account: a one-hour, single-use link. */
import { renderEmail, type RenderedEmail } from './layout';

export function passwordResetEmail(input: { name: string; resetUrl: string; validMinutes: number }): RenderedEmail {
  return renderEmail({
    subject: 'Reset your Sidecheck password',
    paragraphs: [
      `Hello ${input.name},`,
      'Someone asked to reset the password of your Sidecheck account. Open the link to choose a new one; every device signed in to your account will then be signed out.',
    ],
    action: { label: 'Choose a new password', url: input.resetUrl },
    footnote: `The link works once, for ${input.validMinutes} minutes. If you did not ask for this, ignore this message: your password stays as it is.`,
  });
}
