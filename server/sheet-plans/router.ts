/** HTTP routes for a build's sheet plans: make one (queued), list, read. */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { sheetPlanCreateBody } from '../../db/validation-bench';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams } from '../http/params';
import type { JobSender } from '../jobs/job-sender';
import { createSheetPlan, getSheetPlan, listSheetPlans } from './service';

const PLANS_PATH = '/api/shops/:shopId/builds/:buildId/sheet-plans';
const planParams = buildParams.extend({ planId: z.string().uuid('must be an id (a UUID such as 3f1c0e52-8a4b-4c1e-9d2a-5b7e6f0a1c23)') });

/** Returns the sheet-plan routes; `jobs` null answers 503 on create. */
export function sheetPlanRoutes(deps: { db: Db; jobs: JobSender | null }): MountableRoute[] {
  const { db, jobs } = deps;
  return [
    defineRoute({
      method: 'POST',
      path: PLANS_PATH,
      access: { shopRole: 'editor' },
      params: buildParams,
      body: sheetPlanCreateBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 202,
        json: { sheetPlan: await createSheetPlan(db, jobs, user, shop.id, params.buildId, body) },
      }),
    }),
    defineRoute({
      method: 'GET',
      path: PLANS_PATH,
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { sheetPlans: await listSheetPlans(db, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'GET',
      path: `${PLANS_PATH}/:planId`,
      access: { shopRole: 'viewer' },
      params: planParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { sheetPlan: await getSheetPlan(db, shop.id, params.buildId, params.planId) } }),
    }),
  ];
}
