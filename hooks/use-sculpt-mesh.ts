/**
 * The working mesh of one sculpt version for the studio (GET .../sculpts/:sculptId/mesh, the binary format of
 * geometry/io/working-mesh.ts).
 */
import { useQuery } from '@tanstack/react-query';
import { decodeWorkingMesh, type WorkingMesh } from '../geometry/io/working-mesh';
import { ApiError, apiErrorFromResponse } from './api-client';

/**
 * Fetches and decodes the working mesh at `url` (a sculpt's `meshUrl`); disabled while `url` is null. A mesh
 * never changes for one sculpt version, so it is kept while in use. Errors are ApiErrors: the server's own, or
 * BAD_RESPONSE naming what is wrong with the bytes.
 */
export function useSculptMesh(url: string | null) {
  return useQuery({
    queryKey: ['sculpt-mesh', url ?? ''],
    enabled: url !== null,
    staleTime: Infinity,
    gcTime: 60_000,
    retry: (count, error) => count < 2 && !(error instanceof ApiError && error.status >= 400 && error.status < 500),
    queryFn: async (): Promise<WorkingMesh> => {
      let res: Response;
      try {
        res = await fetch(url!, { credentials: 'same-origin', headers: { Accept: 'application/octet-stream' } });
      } catch {
        throw new ApiError(0, 'NETWORK', 'Cannot reach the Sheetsmith server. Check your connection and try again.');
      }
      if (!res.ok) {
        let body: unknown;
        try {
          body = await res.json();
        } catch {
          body = undefined;
        }
        throw apiErrorFromResponse(res.status, body);
      }
      try {
        return decodeWorkingMesh(new Uint8Array(await res.arrayBuffer()));
      } catch (e) {
        throw new ApiError(res.status, 'BAD_RESPONSE', `The sculpt's working mesh could not be read: ${(e as Error).message}`);
      }
    },
  });
}
