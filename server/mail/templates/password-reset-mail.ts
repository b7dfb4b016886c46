/** The password-reset e-mail: the link that sets a new password, that it works once for one hour, and what to do if it was not you. */
import type { MailContent } from '../send-mail';
import { layoutHtml, layoutText, type MailLayout } from './mail-layout';

export interface PasswordResetMailInput {
  /** Full URL of the reset page, token included. */
  resetUrl: string;
  /** How long the link works, in minutes. */
  validMinutes: number;
}

/** Returns the subject and the text and HTML parts of a password-reset mail. */
export function passwordResetMail(input: PasswordResetMailInput): MailContent {
  const span = input.validMinutes % 60 === 0 ? `${input.validMinutes / 60} hour${input.validMinutes === 60 ? '' : 's'}` : `${input.validMinutes} minutes`;
  const layout: MailLayout = {
    heading: 'Set a new Sheetsmith password',
    paragraphs: ['Someone asked to set a new password for the Sheetsmith account of this e-mail address.'],
    action: { label: 'Choose a new password', url: input.resetUrl },
    after: [
      `The link works once, for ${span}. Setting a new password signs the account out on every device.`,
      'If you did not ask for this, ignore this mail: your password stays as it is.',
    ],
  };
  return { subject: 'Your Sheetsmith password reset link', text: layoutText(layout), html: layoutHtml(layout) };
}
