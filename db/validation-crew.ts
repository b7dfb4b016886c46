/**
 * Request-body schemas for crew and clients (invitations, member changes) and for password reset, shared by the
 * server and the app's forms. Free of database drivers so the web bundle can import it.
 */
import { z } from 'zod';
import { emailField, passwordField, ROLES } from './validation';

/** Roles an invitation can carry: crew (editor) or a commission client (viewer). Owners are made by a role change. */
export const INVITE_ROLES = ['editor', 'viewer'] as const;
export type InviteRole = (typeof INVITE_ROLES)[number];

export const invitationCreateBody = z.object({
  email: emailField,
  role: z.enum(INVITE_ROLES, 'Choose editor (crew) or viewer (client)'),
});
export type InvitationCreateBody = z.infer<typeof invitationCreateBody>;

export const memberUpdateBody = z
  .object({
    role: z.enum(ROLES, 'Choose owner, editor or viewer').optional(),
    canSeePrintSets: z.boolean('Send true or false').optional(),
  })
  .refine((b) => b.role !== undefined || b.canSeePrintSets !== undefined, { message: 'Send a new role or canSeePrintSets', path: ['role'] });
export type MemberUpdateBody = z.infer<typeof memberUpdateBody>;

/**
 * A link token as mailed: 32 random bytes in base64url without padding (RFC 4648 §5), which is 43 characters.
 * The message is the same for every malformed value, so people pasting a cut-off link get a useful hint.
 */
export const linkTokenField = z
  .string()
  .regex(/^[A-Za-z0-9_-]{43}$/, 'This link is incomplete or damaged; open it again from the e-mail, or copy the whole address');

export const passwordResetRequestBody = z.object({ email: emailField });
export type PasswordResetRequestBody = z.infer<typeof passwordResetRequestBody>;

export const passwordResetConfirmBody = z.object({ token: linkTokenField, password: passwordField });
export type PasswordResetConfirmBody = z.infer<typeof passwordResetConfirmBody>;
