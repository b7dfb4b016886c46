/** zod schemas for the ids in route paths. */
import { z } from 'zod';

const idParam = z.string().uuid('must be an id (a UUID such as 3f1c0e52-8a4b-4c1e-9d2a-5b7e6f0a1c23)');

export const shopParams = z.object({ shopId: idParam });
export type ShopParams = z.infer<typeof shopParams>;

export const buildParams = z.object({ shopId: idParam, buildId: idParam });
export type BuildParams = z.infer<typeof buildParams>;
