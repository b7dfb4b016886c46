/**
 * The pattern pipeline: from an imported sculpt to the pattern document the print sets, the server and the
 * bench view read. clean → seams → split → thickness offset → flatten → group → bevels → score lines →
 * darts → warnings. Pure: bytes never enter here, and nothing is written.
 */
import { seamBevel } from '../bevel/seam-bevel';
import { seamChains } from '../bevel/seam-chains';
import { GeometryError } from '../errors';
import { flattenPiece, type FlatPiece } from '../flatten/flatten-piece';
import { buildTwins } from '../mesh/half-edges';
import type { ImportedModel } from '../mesh/tri-mesh';
import { applyPlaneMotion, groupPieces, IDENTITY_MOTION, type PlaneMotion } from '../pieces/group-pieces';
import { pieceLabel } from '../pieces/label-pieces';
import { suggestDart } from '../pieces/suggest-dart';
import { offsetDirections } from '../thickness/offset-directions';
import { offsetSurface, surfaceOffsetMm } from '../thickness/offset-surface';
import { SCORE_LINE_MIN_FOLD_DEG, scoreLines } from '../thickness/score-lines';
import type { DartSuggestion, PatternDoc, PatternPiece, PatternSeam, PatternSurface, PieceSeamEdge } from './pattern-doc';
import { pieceOutline, type PieceOutline } from './piece-outline';
import { preparePieces, type PreparedPieces, type SeamSource } from './prepare-pieces';
import { seamSides } from './seam-sides';

export interface BuildPatternOptions {
  /** Seam source (default: the file's `l` lines when it has any, else automatic seams from the budget). */
  seams?: SeamSource;
  /** Foam thickness, mm (default 6, a common mid-weight sheet — common practice). */
  thickness?: number;
  /** Surface the pattern follows (default 'outer', the visible skin of the sculpt). */
  surface?: PatternSurface;
  /** Max stretch per piece, percent (default 3); pieces over it get a warning and a suggested dart. */
  stretchBudgetPct?: number;
  /** Folds inside a piece sharper than this (degrees from flat) get a score line (default 25). */
  scoreLineDeg?: number;
  /** List identical and mirror-image pieces once with a quantity (default true). */
  groupIdentical?: boolean;
  name?: string;
}

/** Default foam thickness, mm: 6 mm EVA is the usual shell weight (DESIGN.md, "What the trade knows"). */
export const DEFAULT_THICKNESS_MM = 6;

/**
 * Shop cautions for cutting, bevelling, heat shaping and gluing foam (DESIGN.md: the product shows the usual
 * cautions and defers to the adhesive maker's safety data sheet and local rules).
 */
export const SHOP_CAUTIONS: readonly string[] = [
  'Blades: cut bevels and score lines with a sharp blade, away from your hands, on a cutting mat; change blades often.',
  'Heat: heat guns and hot tools burn, and overheated foam gives off fumes; shape on a heat-resistant surface with ventilation and eye protection.',
  "Contact cement: solvent-based adhesive is flammable and its vapours are harmful; ventilate, wear a respirator rated for the adhesive's organic vapours and eye protection, keep flames away, and follow the adhesive maker's safety data sheet and local rules.",
];

/**
 * Builds the pattern document for a sculpt.
 *
 * @param model the imported sculpt in mm (see geometry/io/import-model.ts).
 * @param options seams, thickness (mm, ≥ 0), surface, stretch budget (percent), score-line angle, grouping.
 * @returns PatternDoc as geometry/pattern/pattern-doc.ts specifies (lengths mm, angles degrees).
 * @throws GeometryError BAD_OPTION for an option out of range (saying which), FLATTEN_FAILED when a piece
 *   cannot be flattened (saying which piece), and the cleaning/seam errors of preparePieces.
 */
export function buildPattern(model: ImportedModel, options: BuildPatternOptions = {}): PatternDoc {
  const prepared = preparePieces(model, { seams: options.seams, stretchBudgetPct: options.stretchBudgetPct });
  return patternFromPieces(prepared, options);
}

/**
 * The second half of buildPattern: flattening and everything after it, for pieces already prepared (so a
 * change of thickness, surface or budget does not repeat cleaning and seam finding).
 */
export function patternFromPieces(prepared: PreparedPieces, options: BuildPatternOptions = {}): PatternDoc {
  return patternWithFaceMaps(prepared, options).doc;
}

/**
 * Per face of the prepared (cleaned) sculpt: which entry of `doc.pieces` it was cut into (copies grouped with a
 * template map to the template's index; −1 for none), and its stretch in the flat pattern, percent
 * (max(|σ1−1|, |σ2−1|)·100, Sander et al. 2001). Both arrays have one entry per face of `prepared.mesh`.
 */
export interface PatternFaceMaps {
  pieceIndex: Int32Array;
  stretchPct: Float32Array;
}

/**
 * patternFromPieces plus the per-face maps the 3D view colours the sculpt with (PatternFaceMaps).
 * Same arguments, throws and determinism as patternFromPieces.
 */
export function patternWithFaceMaps(prepared: PreparedPieces, options: BuildPatternOptions = {}): { doc: PatternDoc; faces: PatternFaceMaps } {
  const thickness = options.thickness ?? DEFAULT_THICKNESS_MM;
  const surface = options.surface ?? 'outer';
  const budget = options.stretchBudgetPct ?? 3;
  const scoreDeg = options.scoreLineDeg ?? SCORE_LINE_MIN_FOLD_DEG;
  if (!(thickness >= 0) || !Number.isFinite(thickness)) {
    throw new GeometryError('BAD_OPTION', `thickness must be a non-negative number of millimetres, got ${thickness}`);
  }
  if (surface !== 'outer' && surface !== 'mid' && surface !== 'inner') {
    throw new GeometryError('BAD_OPTION', `surface must be outer, mid or inner, got ${String(surface)}`);
  }
  if (!(budget > 0) || !Number.isFinite(budget)) {
    throw new GeometryError('BAD_OPTION', `stretch budget must be a positive percentage, got ${budget}`);
  }
  if (!(scoreDeg > 0 && scoreDeg < 180)) {
    throw new GeometryError('BAD_OPTION', `score-line angle must be between 0 and 180 degrees, got ${scoreDeg}`);
  }
  const { mesh, twin, dihedralDeg, normals, seamMask, pieces, pieceOfFace, localFaceOf } = prepared;
  const warnings = [...prepared.warnings];
  const offset = surfaceOffsetMm(surface, thickness);
  // Crease-aware: a corner moves a full offset behind every face that meets there (offset-directions.ts).
  const offsetDirs = offset > 0 ? offsetDirections(mesh.positions, mesh.triangles, normals) : normals;
  // The surface the pattern follows, whole: seams are measured on it (each piece below offsets the same vertices
  // by the same directions, so its flattened edges lie on this surface).
  const followed = offset > 0 ? offsetSurface(mesh.positions, offsetDirs, offset) : mesh.positions;
  const provisional = pieces.map((_, i) => pieceLabel(i));

  // Flatten every piece on the chosen surface.
  interface Flattened {
    flat: FlatPiece;
    outline: PieceOutline;
    localTwin: Int32Array;
    positions: Float64Array;
    perimeterChangeMm: number;
  }
  const flattened: Flattened[] = pieces.map((piece, i) => {
    const V = piece.positions.length / 3;
    const localTwin = buildTwins(piece.triangles, V);
    let positions = piece.positions;
    if (offset > 0) {
      const pieceDirections = new Float64Array(3 * V);
      for (let v = 0; v < V; v++) {
        const g = piece.vertexIds[v];
        pieceDirections[3 * v] = offsetDirs[3 * g];
        pieceDirections[3 * v + 1] = offsetDirs[3 * g + 1];
        pieceDirections[3 * v + 2] = offsetDirs[3 * g + 2];
      }
      positions = offsetSurface(piece.positions, pieceDirections, offset);
      const folded = foldedTriangles(piece.positions, positions, piece.triangles);
      if (folded > 0) {
        warnings.push(
          `piece ${provisional[i]}: the ${surface} surface of ${thickness} mm foam folds over itself at ${folded} triangle(s); the model curves more tightly than the foam is thick there`,
        );
      }
    }
    let flat: FlatPiece;
    try {
      flat = flattenPiece({ positions, triangles: piece.triangles });
    } catch (e) {
      if (e instanceof GeometryError) {
        throw new GeometryError(e.code, `piece ${provisional[i]} (${piece.faceIds.length} faces): ${e.message}`, {
          face: piece.faceIds[0],
        });
      }
      throw e;
    }
    const outline = pieceOutline(piece.triangles, localTwin, flat.uv);
    if (!outline) {
      throw new GeometryError('FLATTEN_FAILED', `piece ${provisional[i]} has no outline: it is a closed surface`, {
        face: piece.faceIds[0],
      });
    }
    const perimeterChangeMm =
      offset > 0 ? loopsLength3d(positions, outline.loops) - loopsLength3d(piece.positions, outline.loops) : 0;
    return { flat, outline, localTwin, positions, perimeterChangeMm };
  });

  // Group identical and mirrored pieces; groups take the labels A, B, … in order.
  const groups =
    options.groupIdentical === false
      ? pieces.map((_, i) => ({ representative: i, members: [{ index: i, mirrored: false, toTemplate: IDENTITY_MOTION }] }))
      : groupPieces(
          flattened.map((f, i) => ({
            outline: f.outline.outline,
            area2d: f.flat.area2d,
            area3d: f.flat.area3d,
            faces: pieces[i].faceIds.length,
            holes: f.outline.holes.length,
          })),
        );
  const labelOf: string[] = new Array(pieces.length);
  // Where each piece's seam edges go: its group's representative, as copy number `copy`, carried into the
  // template's frame by `toTemplate`.
  const placeOf: Array<{ representative: number; copy: number; toTemplate: PlaneMotion }> = new Array(pieces.length);
  groups.forEach((g, gi) => {
    g.members.forEach((m, copy) => {
      labelOf[m.index] = pieceLabel(gi);
      placeOf[m.index] = { representative: g.representative, copy, toTemplate: m.toTemplate };
    });
  });

  // Seams, their bevels and each side's run along a piece outline.
  const seamEdgesOf: PieceSeamEdge[][] = pieces.map(() => []);
  /** Most negative change of a seam's length from the outer skin to the followed surface, mm. */
  let seamChangeMm = 0;
  const seams: PatternSeam[] = seamChains(mesh.triangles, twin, seamMask, pieceOfFace).map((chain, k) => {
    const label = String(k + 1);
    // Angles are the sculpt's; lengths and stations are on the surface the pattern follows, so both pieces' 2D
    // sides match length3d, and the outer skin's length is kept beside it.
    const bevel = seamBevel(followed, chain.vertices, Float64Array.from(chain.halfEdges, (h) => dihedralDeg[h]));
    const outerLength = offset > 0 ? polylineLength3d(mesh.positions, chain.vertices) : bevel.length3d;
    const sides = seamSides(chain, mesh.triangles, twin, pieces, pieceOfFace, localFaceOf, (p) => flattened[p].flat.uv);
    sides.forEach((side, s) => {
      const place = placeOf[side.piece];
      seamEdgesOf[place.representative].push({
        seam: label,
        side: s as 0 | 1,
        copy: place.copy,
        path: place.copy === 0 ? side.path : side.path.map((p) => applyPlaneMotion(place.toTemplate, p)),
        bevelDeg: bevel.bevel.mean,
        bevelFace: bevel.bevelFace,
      });
    });
    const self = chain.pieces[0] === chain.pieces[1];
    seamChangeMm = Math.min(seamChangeMm, bevel.length3d - outerLength);
    const seam: PatternSeam = {
      label,
      pieces: self ? [labelOf[chain.pieces[0]]] : [labelOf[chain.pieces[0]], labelOf[chain.pieces[1]]],
      length3d: bevel.length3d,
      lengths: [sides[0].length2d, sides[1].length2d],
      dihedral: bevel.dihedral,
      bevel: bevel.bevel,
      convex: bevel.convex,
      bevelFace: bevel.bevelFace,
      stations: bevel.stations,
    };
    if (offset > 0) seam.length3dOuter = outerLength;
    return seam;
  });

  // Pieces in group order, with score lines and darts on the representative.
  const outPieces: PatternPiece[] = groups.map((g, gi) => {
    const i = g.representative;
    const piece = pieces[i];
    const { flat, outline, localTwin, positions, perimeterChangeMm } = flattened[i];
    const label = pieceLabel(gi);
    const localDihedral = new Float64Array(piece.triangles.length);
    for (let lh = 0; lh < localDihedral.length; lh++) {
      const f = piece.faceIds[(lh / 3) | 0];
      localDihedral[lh] = dihedralDeg[globalHalfEdge(mesh.triangles, f, piece.vertexIds[piece.triangles[lh]])];
    }
    const darts: DartSuggestion[] = [];
    if (flat.stretch.maxPct > budget) {
      const suggested = suggestDart({ positions, triangles: piece.triangles }, flat);
      // A dart is only worth cutting when it leaves less stretch than the piece has without it.
      const dart = suggested && suggested.stretchAfterPct < flat.stretch.maxPct ? suggested : null;
      if (dart) darts.push(dart);
      warnings.push(
        `piece ${label} stretches up to ${flat.stretch.maxPct.toFixed(1)} % (budget ${budget} %): ` +
          (dart
            ? `cut the suggested dart (it leaves ${dart.stretchAfterPct.toFixed(1)} %) or add a seam through its most curved part`
            : 'add a seam through its most curved part'),
      );
    }
    if (flat.flipped > 0) {
      warnings.push(`piece ${label}: ${flat.flipped} triangle(s) fold over in the flat pattern; add a seam there`);
    }
    const mirroredCopies = g.members.filter((m) => m.mirrored).length;
    const out: PatternPiece = {
      label,
      faces: piece.faceIds.length,
      area3d: flat.area3d,
      area2d: flat.area2d,
      outline: outline.outline,
      holes: outline.holes,
      stretch: { maxPct: flat.stretch.maxPct, rmsPct: flat.stretch.rmsPct },
      quantity: g.members.length,
      mirrored: mirroredCopies > 0,
      thickness,
      surface,
      perimeterChangeMm,
      seamEdges: seamEdgesOf[i].sort((x, y) => (x.copy ?? 0) - (y.copy ?? 0)),
      scoreLines: scoreLines(piece.triangles, localTwin, localDihedral, flat.uv, scoreDeg),
      darts,
      textureLine: null,
    };
    if (mirroredCopies > 0) out.mirroredCopies = mirroredCopies;
    return out;
  });

  if (offset > 0) {
    const largest = Math.max(0, ...flattened.map((f) => -f.perimeterChangeMm));
    warnings.push(
      `the pattern follows the ${surface === 'mid' ? 'middle' : 'inner face'} of ${thickness} mm foam (${offset} mm inside the sculpt's skin): ` +
        `outlines are up to ${largest.toFixed(1)} mm shorter around than on the outer skin, ` +
        `and seams up to ${(-seamChangeMm).toFixed(1)} mm shorter (each seam's length3d is on the ${surface} surface, length3dOuter on the skin)`,
    );
  }
  const doc: PatternDoc = { units: 'mm', pieces: outPieces, seams, warnings, cautions: [...SHOP_CAUTIONS] };
  if (options.name) doc.name = options.name;
  const groupOf = new Int32Array(pieces.length);
  groups.forEach((g, gi) => g.members.forEach((m) => (groupOf[m.index] = gi)));
  const F = pieceOfFace.length;
  const faces: PatternFaceMaps = { pieceIndex: new Int32Array(F).fill(-1), stretchPct: new Float32Array(F) };
  for (let f = 0; f < F; f++) {
    const p = pieceOfFace[f];
    if (p < 0) continue;
    faces.pieceIndex[f] = groupOf[p];
    faces.stretchPct[f] = flattened[p].flat.trianglePct[localFaceOf[f]];
  }
  return { doc, faces };
}

/** The half-edge of global face f that starts at global vertex v. */
function globalHalfEdge(triangles: Uint32Array, f: number, v: number): number {
  for (let k = 0; k < 3; k++) if (triangles[3 * f + k] === v) return 3 * f + k;
  throw new RangeError(`face ${f} has no corner at vertex ${v}`);
}

/** Length of a vertex polyline, mm. */
function polylineLength3d(positions: Float64Array, vertices: Uint32Array): number {
  let sum = 0;
  for (let k = 0; k + 1 < vertices.length; k++) {
    const a = 3 * vertices[k];
    const b = 3 * vertices[k + 1];
    sum += Math.hypot(positions[b] - positions[a], positions[b + 1] - positions[a + 1], positions[b + 2] - positions[a + 2]);
  }
  return sum;
}

function loopsLength3d(positions: Float64Array, loops: Uint32Array[]): number {
  let sum = 0;
  for (const loop of loops) {
    for (let k = 0; k < loop.length; k++) {
      const a = 3 * loop[k];
      const b = 3 * loop[(k + 1) % loop.length];
      sum += Math.hypot(positions[b] - positions[a], positions[b + 1] - positions[a + 1], positions[b + 2] - positions[a + 2]);
    }
  }
  return sum;
}

/** Triangles whose normal turned around when the surface was offset (offset deeper than the curvature radius). */
function foldedTriangles(before: Float64Array, after: Float64Array, triangles: Uint32Array): number {
  const normal = (p: Float64Array, f: number): [number, number, number] => {
    const a = 3 * triangles[3 * f];
    const b = 3 * triangles[3 * f + 1];
    const c = 3 * triangles[3 * f + 2];
    const ux = p[b] - p[a], uy = p[b + 1] - p[a + 1], uz = p[b + 2] - p[a + 2];
    const vx = p[c] - p[a], vy = p[c + 1] - p[a + 1], vz = p[c + 2] - p[a + 2];
    return [uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx];
  };
  let count = 0;
  for (let f = 0; f < triangles.length / 3; f++) {
    const n0 = normal(before, f);
    const n1 = normal(after, f);
    if (n0[0] * n1[0] + n0[1] * n1[1] + n0[2] * n1[2] < 0) count++;
  }
  return count;
}
