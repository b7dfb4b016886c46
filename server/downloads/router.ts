/** HTTP routes of a buyer's download link: what it offers, and each file (each file download counts one use). */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import type { FileStore } from '../storage/file-store';
import { getDownload, openDownloadFile } from './service';

const tokenParams = z.object({ token: z.string().min(1).max(200) });
const fileParams = z.object({ token: z.string().min(1).max(200), name: z.string().min(1).max(200) });

/** Returns the download routes. */
export function downloadRoutes(deps: { db: Db; files: FileStore }): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/downloads/:token',
      access: 'public',
      params: tokenParams,
      handler: async ({ params, res }) => {
        res.setHeader('Cache-Control', 'no-store');
        return { status: 200, json: { download: await getDownload(deps.db, params.token) } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/downloads/:token/files/:name',
      access: 'public',
      params: fileParams,
      handler: async ({ params, res }) => {
        const { file, contentType, name } = await openDownloadFile(deps.db, deps.files, params.token, params.name);
        res.setHeader('Cache-Control', 'no-store');
        return { status: 200, file: { stream: file.stream, sizeBytes: file.sizeBytes, contentType, fileName: name } };
      },
    }),
  ];
}
