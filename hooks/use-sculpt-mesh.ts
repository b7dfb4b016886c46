/**
 * The working mesh of one sculpt version for the studio (GET .../sculpts/:sculptId/mesh, the binary format of
 * geometry/io/working-mesh.ts).
 */
import { useQuery } from '@tanstack/react-query';
import { decodeWorkingMesh, type WorkingMesh } from '../geometry/io/working-mesh';
import { ApiError, fetchBytes } from './api-client';

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
    queryFn: (): Promise<WorkingMesh> => fetchBytes(url!, decodeWorkingMesh, "The sculpt's working mesh"),
  });
}
