/**
 * The first half of the pattern pipeline, everything that depends only on the sculpt and its seams:
 * clean → half-edges → dihedral angles → seams → split into pieces. Its result is reused when the maker
 * changes thickness, surface or budget (precompute once, solve many, as libigl splits its solvers).
 */
import { GeometryError } from '../errors';
import { cleanMesh } from '../mesh/clean-mesh';
import { interiorDihedralDeg } from '../mesh/dihedral-angles';
import { buildTwins } from '../mesh/half-edges';
import type { ImportedModel, TriMesh } from '../mesh/tri-mesh';
import { vertexNormals } from '../mesh/vertex-normals';
import { splitPieces, type PieceMesh } from '../pieces/split-pieces';
import { autoSeams } from '../seams/auto-seams';
import { creaseSeams } from '../seams/crease-seams';
import { seamsFromPolylines } from '../seams/seams-from-polylines';

/** Where the seams come from: the file's `l` polylines, edges sharper than a crease angle, or the budget. */
export type SeamSource = 'obj' | { crease: number } | 'auto';

export interface PrepareOptions {
  seams?: SeamSource;
  /** Max stretch per piece, percent, for `auto` seams and for opening closed pieces (default 3). */
  stretchBudgetPct?: number;
}

export interface PreparedPieces {
  /** The cleaned sculpt (outer skin), mm. */
  mesh: TriMesh;
  twin: Int32Array;
  /** Interior dihedral per half-edge, degrees (180 flat). */
  dihedralDeg: Float64Array;
  /** Angle-weighted unit vertex normals of the whole sculpt, Float64Array(3V). */
  normals: Float64Array;
  /** SeamMask, Uint8Array(3F). */
  seamMask: Uint8Array;
  pieces: PieceMesh[];
  /** Piece index per global face. */
  pieceOfFace: Int32Array;
  /** Local face index (within its piece) per global face. */
  localFaceOf: Int32Array;
  /** Notes from cleaning and seam finding, for the maker. */
  warnings: string[];
}

/**
 * Cleans the model, finds its seams and splits it into pieces.
 *
 * @param model an imported model, mm.
 * @param options seam source (default: 'obj' when the file has `l` polylines, else 'auto' from the budget) and
 *   budget.
 * @returns the prepared pieces. Any piece the seams leave closed (a shell with no boundary cannot lie flat) is
 *   opened with automatic seams inside it, and a warning says so.
 * @throws GeometryError BAD_OPTION for a crease angle outside (0, 180) or a bad budget; NO_FACES when cleaning
 *   leaves nothing.
 */
export function preparePieces(model: ImportedModel, options: PrepareOptions = {}): PreparedPieces {
  const budget = options.stretchBudgetPct ?? 3;
  if (!(budget > 0) || !Number.isFinite(budget)) {
    throw new GeometryError('BAD_OPTION', `stretch budget must be a positive percentage, got ${budget}`);
  }
  const source: SeamSource = options.seams ?? (model.seamPolylines.length > 0 ? 'obj' : 'auto');
  if (typeof source === 'object' && !(source.crease > 0 && source.crease < 180)) {
    throw new GeometryError('BAD_OPTION', `crease angle must be between 0 and 180 degrees, got ${source.crease}`);
  }
  const warnings: string[] = [];
  const { model: clean, report } = cleanMesh(model);
  // Routine lines (vertices welded, the part count) are not problems; repairs and non-manifold spots are.
  warnings.push(...report.notes.filter((n) => !/^welded |^\d+ connected parts?, /.test(n)));
  const mesh = clean.mesh;
  const V = mesh.positions.length / 3;
  const F = mesh.triangles.length / 3;
  if (F === 0) throw new GeometryError('NO_FACES', 'the model has no usable faces left after cleaning');
  const twin = buildTwins(mesh.triangles, V);
  const dihedralDeg = interiorDihedralDeg(mesh.positions, mesh.triangles, twin);

  let seamMask: Uint8Array;
  if (source === 'auto') {
    seamMask = autoSeams(mesh, twin, { stretchBudgetPct: budget, symmetric: true });
  } else if (source === 'obj') {
    if (clean.seamPolylines.length === 0) {
      warnings.push("the file has no seam lines ('l' polylines); pieces follow the model's open edges only");
      seamMask = new Uint8Array(3 * F);
    } else {
      const found = seamsFromPolylines(mesh, twin, clean.seamPolylines);
      seamMask = found.mask;
      // The finder's messages already name their line ("seam line 2, step 3: …"); say it once.
      for (const problem of found.problems) {
        warnings.push(`seam line ${problem.polyline + 1}: ${problem.message.replace(/^seam line \d+, /, '')}`);
      }
    }
  } else {
    seamMask = creaseSeams(mesh.positions, mesh.triangles, twin, source.crease);
  }

  let pieces = splitPieces(mesh, twin, seamMask);
  const opened = openClosedPieces(mesh, twin, seamMask, pieces, budget);
  if (opened.length > 0) {
    pieces = splitPieces(mesh, twin, seamMask);
    warnings.push(
      `${opened.length === 1 ? 'one part was' : `${opened.length} parts were`} a closed shell that cannot lie flat; ` +
        'automatic seams were added to open it (mark your own seams to choose where they go)',
    );
  }
  const pieceOfFace = new Int32Array(F).fill(-1);
  const localFaceOf = new Int32Array(F).fill(-1);
  pieces.forEach((p, i) =>
    p.faceIds.forEach((f, lf) => {
      pieceOfFace[f] = i;
      localFaceOf[f] = lf;
    }),
  );
  const normals = vertexNormals(mesh.positions, mesh.triangles);
  return { mesh, twin, dihedralDeg, normals, seamMask, pieces, pieceOfFace, localFaceOf, warnings };
}

/**
 * Adds automatic seams inside every piece with no boundary, writing them into `seamMask` (global half-edges).
 * Returns the indices of the pieces that were opened.
 */
function openClosedPieces(
  mesh: TriMesh,
  twin: Int32Array,
  seamMask: Uint8Array,
  pieces: PieceMesh[],
  budget: number,
): number[] {
  const opened: number[] = [];
  pieces.forEach((piece, i) => {
    const localTwin = buildTwins(piece.triangles, piece.positions.length / 3);
    if (localTwin.some((t) => t < 0)) return;
    const localMask = autoSeams({ positions: piece.positions, triangles: piece.triangles }, localTwin, {
      stretchBudgetPct: budget,
    });
    for (let lh = 0; lh < localMask.length; lh++) {
      if (!localMask[lh]) continue;
      const f = piece.faceIds[(lh / 3) | 0];
      const from = piece.vertexIds[piece.triangles[lh]];
      for (let k = 0; k < 3; k++) {
        const h = 3 * f + k;
        if (mesh.triangles[h] === from && twin[h] >= 0) {
          seamMask[h] = 1;
          seamMask[twin[h]] = 1;
        }
      }
    }
    opened.push(i);
  });
  return opened;
}
