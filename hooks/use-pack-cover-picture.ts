/**
 * A cover picture for a build's pattern pack, taken from the studio's 3D view and kept in this browser tab's
 * session storage until the owner publishes the pack from the build page (the picture is a PNG data URL the
 * packs API accepts as a cover).
 */
import { useCallback, useState } from 'react';

const keyOf = (buildId: string) => `sheetsmith-pack-cover:${buildId}`;

function storage(): Storage | null {
  try {
    return typeof window !== 'undefined' && window.sessionStorage ? window.sessionStorage : null;
  } catch {
    // Storage can be switched off (private modes, blocked cookies); the picture is then simply not kept.
    return null;
  }
}

/** Returns the build's kept cover picture (a data URL or null) and functions to keep a new one or drop it. */
export function usePackCoverPicture(buildId: string): { picture: string | null; keep(dataUrl: string): boolean; drop(): void } {
  const [picture, setPicture] = useState<string | null>(() => storage()?.getItem(keyOf(buildId)) ?? null);
  const keep = useCallback(
    (dataUrl: string) => {
      setPicture(dataUrl);
      try {
        storage()?.setItem(keyOf(buildId), dataUrl);
        return true;
      } catch {
        // Over the storage quota: the picture stays for this page only.
        return false;
      }
    },
    [buildId],
  );
  const drop = useCallback(() => {
    setPicture(null);
    storage()?.removeItem(keyOf(buildId));
  }, [buildId]);
  return { picture, keep, drop };
}
