/** The invitation e-mail: who invites whom into which shop, at which role, the link to accept and when it stops working. */
import type { Role } from '../../../db/validation';
import type { MailContent } from '../send-mail';
import { layoutHtml, layoutText, type MailLayout } from './mail-layout';

export interface InvitationMailInput {
  shopName: string;
  role: Role;
  /** Name of the person who sent the invitation. */
  invitedByName: string;
  /** Full URL of the accept page, token included. */
  acceptUrl: string;
  expiresAt: Date;
}

/** What each role may do, in the words a maker would use. */
const ROLE_WORDS: Record<Role, string> = {
  owner: 'as an owner: you can run the shop, its builds and its members',
  editor: 'as crew: you can work on builds, tick off pieces and leave notes at the bench',
  viewer: 'as a client: you can follow builds, see the 3D preview and the progress',
};

/** Returns the subject and the text and HTML parts of an invitation. */
export function invitationMail(input: InvitationMailInput): MailContent {
  const layout: MailLayout = {
    heading: `Join ${input.shopName} on Sheetsmith`,
    paragraphs: [`${input.invitedByName} invites you to the shop "${input.shopName}" ${ROLE_WORDS[input.role]}.`],
    action: { label: 'Accept the invitation', url: input.acceptUrl },
    after: [
      `The link works once and until ${input.expiresAt.toUTCString()}. You can sign in or make an account with this e-mail address when you open it.`,
      'If you were not expecting this, you can ignore the mail; nothing happens unless the link is opened and accepted.',
    ],
  };
  return { subject: `${input.invitedByName} invites you to ${input.shopName}`, text: layoutText(layout), html: layoutHtml(layout) };
}
