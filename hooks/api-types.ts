/**
 * Shapes of the API's answers, checked on arrival so a mismatch is reported instead of rendering garbage.
 * Ids are kept as strings whether the server sends numbers or strings.
 */
import { z } from 'zod';
import { ROLES } from '../db/validation';

const id = z.union([z.string().min(1), z.number().int()]).transform(String);
const timestamp = z.string().refine((s) => !Number.isNaN(Date.parse(s)), 'expected an ISO 8601 date-time');

export const userSchema = z.object({
  id,
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean().optional().default(false),
});
export type User = z.infer<typeof userSchema>;

export const membershipSchema = z.object({ shopId: id, shopName: z.string(), role: z.enum(ROLES) });
export type Membership = z.infer<typeof membershipSchema>;

/** GET /api/me, and the answer of sign-in and sign-up. */
export const meSchema = z.object({ user: userSchema, memberships: z.array(membershipSchema) });
export type Me = z.infer<typeof meSchema>;

export const buildSchema = z.object({ id, shopId: id, name: z.string(), createdAt: timestamp, updatedAt: timestamp });
export type Build = z.infer<typeof buildSchema>;

export const buildListSchema = z.object({ builds: z.array(buildSchema) });
export const buildEnvelopeSchema = z.object({ build: buildSchema });

export const shopCreatedSchema = z.object({ shop: z.object({ id, name: z.string() }), role: z.enum(ROLES) });
