/** HTTP routes for a build's pieces: the list, the maker's settings, the crew's checklist and notes. */
import type { Db } from '../../db/client';
import { pieceLabelField, pieceNoteBody, pieceProgressBody, pieceSettingsBody } from '../../db/validation-bench';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams } from '../http/params';
import type { JobSender } from '../jobs/job-sender';
import { addPieceNote, changePieceProgress, changePieceSettings, listPieceNotes, listPieces } from './service';

const PIECES_PATH = '/api/shops/:shopId/builds/:buildId/pieces';
const pieceParams = buildParams.extend({ label: pieceLabelField });

/** Returns the piece routes; `jobs` queues the pattern again after a settings change (null: no queue). */
export function pieceRoutes(deps: { db: Db; jobs: JobSender | null }): MountableRoute[] {
  const { db, jobs } = deps;
  return [
    defineRoute({
      method: 'GET',
      path: PIECES_PATH,
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { pieces: await listPieces(db, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'PATCH',
      path: `${PIECES_PATH}/:label`,
      access: { shopRole: 'editor' },
      params: pieceParams,
      body: pieceSettingsBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 200,
        json: await changePieceSettings(db, jobs, user, shop.id, params.buildId, params.label, body),
      }),
    }),
    defineRoute({
      method: 'PATCH',
      path: `${PIECES_PATH}/:label/progress`,
      access: { shopRole: 'editor' },
      params: pieceParams,
      body: pieceProgressBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 200,
        json: { piece: await changePieceProgress(db, user, shop.id, params.buildId, params.label, body) },
      }),
    }),
    defineRoute({
      method: 'GET',
      path: `${PIECES_PATH}/:label/notes`,
      access: { shopRole: 'viewer' },
      params: pieceParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { notes: await listPieceNotes(db, shop.id, params.buildId, params.label) } }),
    }),
    defineRoute({
      method: 'POST',
      path: `${PIECES_PATH}/:label/notes`,
      access: { shopRole: 'editor' },
      params: pieceParams,
      body: pieceNoteBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 201,
        json: { note: await addPieceNote(db, user, shop.id, params.buildId, params.label, body) },
      }),
    }),
  ];
}
