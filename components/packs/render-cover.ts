/**
 * Cover images from the 3D view: the studio hands its canvas here and gets a PNG data URL that the publish form
 * (or useSetPackCover) sends as the pack's cover.
 */

/** Largest cover edge in px; a larger canvas is scaled down so the PNG stays well under the 5 MB limit. */
export const COVER_MAX_EDGE_PX = 1200;

/**
 * Returns a PNG data URL of `canvas`, scaled down to at most COVER_MAX_EDGE_PX on its longer edge. A WebGL canvas
 * must be drawn with `preserveDrawingBuffer: true` (or be read in the same frame it was drawn), else it reads
 * back blank. Throws an Error when the canvas is empty (0 px) or cannot be read.
 */
export function renderCoverFromCanvas(canvas: HTMLCanvasElement): string {
  if (canvas.width === 0 || canvas.height === 0) throw new Error('The 3D view has no size yet, so no cover could be taken');
  const scale = Math.min(1, COVER_MAX_EDGE_PX / Math.max(canvas.width, canvas.height));
  if (scale === 1) return canvas.toDataURL('image/png');
  const out = document.createElement('canvas');
  out.width = Math.round(canvas.width * scale);
  out.height = Math.round(canvas.height * scale);
  const ctx = out.getContext('2d');
  if (!ctx) throw new Error('This browser cannot draw the cover image');
  ctx.drawImage(canvas, 0, 0, out.width, out.height);
  return out.toDataURL('image/png');
}
