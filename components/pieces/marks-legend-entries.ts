/**
 * The legend's wording for each mark, shared by the web and native legends. The meanings follow the print set's
 * own legend (geometry/export/piece-drawing.ts), so the screen and the paper explain the marks alike.
 */
export const LEGEND_ENTRIES = [
  { key: 'cut', name: 'Cut line', meaning: 'solid outline; cut square unless a bevel is marked.' },
  { key: 'match', name: 'Match mark', meaning: 'ticks on the edge (long = tens, short = units) and the seam number in a square; the same mark sits on both pieces of a seam, line them up at glue-up.' },
  { key: 'outside', name: 'Outside corner', meaning: 'hollow triangles along the edge: bevel it, taking foam off the inner face.' },
  { key: 'inside', name: 'Inside corner', meaning: 'solid triangles along the edge: bevel it, taking foam off the outer face.' },
  { key: 'station', name: 'Station', meaning: 'a bar across the edge with an angle: the bevel changes along the seam; cut that angle there.' },
  { key: 'score', name: 'Score line', meaning: 'dash-dot line: cut a shallow V-groove on the inner face, then fold.' },
  { key: 'dart', name: 'Dart', meaning: 'dashed line ending in a V: cut to the V and close it to take out stretch.' },
] as const;

export type LegendKey = (typeof LEGEND_ENTRIES)[number]['key'];
