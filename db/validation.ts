/**
 * Request-body schemas shared by the server (validation) and the app (react-hook-form resolvers).
 * Keep this module free of database drivers so the web bundle can import it.
 */
import { z } from 'zod';

export const ROLES = ['owner', 'editor', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const emailField = z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.com').max(254);
export const passwordField = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');
export const displayNameField = z.string().trim().min(1, 'Enter your name').max(80, 'Use at most 80 characters');

export const signUpBody = z.object({
  name: displayNameField,
  email: emailField,
  password: passwordField,
});
export type SignUpBody = z.infer<typeof signUpBody>;

export const signInBody = z.object({
  email: emailField,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignInBody = z.infer<typeof signInBody>;

export const buildNameField = z.string().trim().min(1, 'Give the build a name').max(120, 'Use at most 120 characters');

export const buildCreateBody = z.object({ name: buildNameField });
export type BuildCreateBody = z.infer<typeof buildCreateBody>;

export const buildRenameBody = z.object({ name: buildNameField });
export type BuildRenameBody = z.infer<typeof buildRenameBody>;

export const shopCreateBody = z.object({
  name: z.string().trim().min(1, 'Give the shop a name').max(80, 'Use at most 80 characters'),
});
export type ShopCreateBody = z.infer<typeof shopCreateBody>;
