/**
 * Routes are declared with `defineRoute` (method, path, access rule, optional zod schemas for path and body,
 * handler) and mounted with `mountRoutes`. Mounting checks every route against the access table in
 * server/auth/access.ts: a route missing from the table, or with a different rule, stops the server at
 * start-up, and so does a table entry no route serves. The access rule is a required field, so a route
 * without one does not compile.
 */
import type { Request, RequestHandler, Response, Router } from 'express';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { z } from 'zod';
import type { Role } from '../../db/validation';
import { ROUTE_ACCESS, describeAccess, sameAccess, type AccessRule, type HttpMethod } from '../auth/access';
import { validationError } from '../errors';

/** The signed-in person as the handlers see them. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** The shop a shop route names and the caller's role there (null: a site admin reading without membership). */
export interface ShopAccess {
  id: string;
  role: Role | null;
}

export type CallerFor<A extends AccessRule> = A extends 'public'
  ? { user: SessionUser | null }
  : A extends { shopRole: Role }
    ? { user: SessionUser; shop: ShopAccess }
    : { user: SessionUser };

export type RouteInput<A extends AccessRule, B, P> = CallerFor<A> & { body: B; params: P; req: Request; res: Response };

/** A file answer: its bytes as a stream, its size, media type and the name offered for saving it. */
export interface FileAnswer {
  stream: Readable;
  sizeBytes: number;
  contentType: string;
  fileName: string;
}

/** What a handler answers: a status with a JSON body, a status with no body (204), or a file. */
export type RouteResult = { status: number; json?: unknown } | { status: number; file: FileAnswer };

/**
 * Sends a file as an attachment (RFC 6266 Content-Disposition; names are plain ASCII here, so the quoted
 * form suffices). Browsers then save SVG and the like instead of rendering them inside the app's origin.
 */
async function sendFile(res: Response, status: number, file: FileAnswer): Promise<void> {
  res.status(status);
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Length', String(file.sizeBytes));
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName.replace(/["\\]/g, '_')}"`);
  await pipeline(file.stream, res);
}

export interface RouteDefinition<A extends AccessRule, B, P> {
  method: HttpMethod;
  path: string;
  access: A;
  params?: z.ZodType<P>;
  body?: z.ZodType<B>;
  /** Extra middleware run before the access check (e.g. a rate limiter). */
  before?: RequestHandler[];
  handler: (input: RouteInput<A, B, P>) => Promise<RouteResult>;
}

/** Resolves who is calling and whether they may; supplied by the app (it needs the database and session key). */
export type AccessGuard = (
  req: Request,
  res: Response,
  rule: AccessRule,
  method: HttpMethod,
  shopId: string | null,
) => Promise<{ user: SessionUser | null; shop?: ShopAccess }>;

/** A route ready to mount; its handler input is checked by `defineRoute`. */
export interface MountableRoute {
  method: HttpMethod;
  path: string;
  access: AccessRule;
  mount(router: Router, guard: AccessGuard): void;
}

/**
 * Returns a mountable route. `params` and `body` schemas are applied before the handler runs (failures answer
 * 400 VALIDATION with per-field messages); path parameters are checked after the caller is known, so an
 * anonymous caller gets 401 rather than a hint about the URL's shape.
 */
export function defineRoute<const A extends AccessRule, B = undefined, P = Record<string, never>>(
  def: RouteDefinition<A, B, P>,
): MountableRoute {
  if (typeof def.access === 'object' && !def.params) {
    // Without a schema an id like "abc" would reach the database and fail there as a server error.
    throw new Error(`route ${def.method} ${def.path} checks a shop role, so it must declare a params schema with shopId`);
  }
  const verb = def.method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete';
  return {
    method: def.method,
    path: def.path,
    access: def.access,
    mount(router, guard) {
      const run: RequestHandler = async (req, res) => {
        const parsedParams = def.params ? def.params.safeParse(req.params) : null;
        if (parsedParams && !parsedParams.success) {
          await guard(req, res, def.access === 'public' ? 'public' : 'signedIn', def.method, null);
          throw validationError(parsedParams.error, 'path');
        }
        const shopId = typeof def.access === 'object' ? String(req.params.shopId ?? '') : null;
        const caller = await guard(req, res, def.access, def.method, shopId);
        let body = undefined as B;
        if (def.body) {
          const parsedBody = def.body.safeParse(req.body ?? {});
          if (!parsedBody.success) throw validationError(parsedBody.error, 'body');
          body = parsedBody.data;
        }
        const params = (parsedParams?.data ?? {}) as P;
        // The guard has enforced the rule, so the caller has the shape the rule promises (see CallerFor).
        const input = { ...caller, body, params, req, res } as unknown as RouteInput<A, B, P>;
        const result = await def.handler(input);
        if ('file' in result) await sendFile(res, result.status, result.file);
        else if (result.json === undefined) res.status(result.status).end();
        else res.status(result.status).json(result.json);
      };
      router[verb](def.path, ...(def.before ?? []), run);
    },
  };
}

/**
 * Mounts `routes` on `router` after checking them against ROUTE_ACCESS. Throws (at start-up) when a route is
 * not in the table, has another rule, is declared twice, or when a table entry has no route.
 */
export function mountRoutes(router: Router, routes: readonly MountableRoute[], guard: AccessGuard): void {
  const seen = new Set<string>();
  for (const route of routes) {
    const key = `${route.method} ${route.path}`;
    if (seen.has(key)) throw new Error(`route ${key} is declared twice`);
    seen.add(key);
    const entry = ROUTE_ACCESS.find((e) => e.method === route.method && e.path === route.path);
    if (!entry) throw new Error(`route ${key} has no entry in the access table (server/auth/access.ts)`);
    if (!sameAccess(entry.access, route.access)) {
      throw new Error(
        `route ${key} declares access "${describeAccess(route.access)}" but the access table says "${describeAccess(entry.access)}"`,
      );
    }
  }
  const unserved = ROUTE_ACCESS.filter((e) => !seen.has(`${e.method} ${e.path}`));
  if (unserved.length > 0) {
    throw new Error(`the access table lists routes nothing serves: ${unserved.map((e) => `${e.method} ${e.path}`).join(', ')}`);
  }
  for (const route of routes) route.mount(router, guard);
}
