/**
 * Sheetsmith's engine, as the server, the workers, the command line and the browser use it. Everything here is
 * pure (typed arrays in, typed arrays or plain objects out; no file system, network, clock or DOM).
 *
 * Not re-exported, so a browser bundle does not pull them in: the PDF writers (geometry/export/print-set-pdf.ts,
 * bench-card-pdf.ts, which need pdfkit) and the scan reducer (geometry/mesh/simplify-mesh.ts, which needs the
 * meshoptimizer WebAssembly module). Import those files directly on the Node side.
 */

// Units and errors.
export * from './units';
export { GeometryError, isGeometryError, type GeometryErrorCode, type GeometryErrorWhere } from './errors';

// Meshes: import, clean, topology and measures.
export { vertexCount, triangleCount, type TriMesh, type ImportedModel } from './mesh/tri-mesh';
export { importModel, detectModelFormat, type ImportOptions, type ModelFormat } from './io/import-model';
export { cleanMesh, type CleanOptions, type CleanReport } from './mesh/clean-mesh';
export { buildTwins, nonManifoldEdges, nextHalfEdge, prevHalfEdge } from './mesh/half-edges';
export { boundaryLoops } from './mesh/boundary-loops';
export { eulerCharacteristic } from './mesh/euler-characteristic';
export { interiorDihedralDeg } from './mesh/dihedral-angles';
export { angleDefects } from './mesh/angle-defect';
export { vertexNormals } from './mesh/vertex-normals';
export { faceComponents } from './mesh/connected-components';
export { boundingBox, boundingBoxDiagonal, surfaceArea, triangleAreas } from './mesh/mesh-measures';

// Generated shapes (tests, the demo build, and previews).
export * from './shapes';

// Seams (cheap enough for the browser's seam tool) and pieces.
export { emptySeamMask, addSeamEdge, removeSeamEdge, isSeamEdge, seamEdgesOf, type SeamMask } from './seams/seam-mask';
export { seamsFromPolylines, type SeamProblem } from './seams/seams-from-polylines';
export { creaseSeams } from './seams/crease-seams';
export { seamPath, type SeamPathOptions } from './seams/seam-path';
export { findSymmetryPlane, mirrorSeams, type SymmetryPlane } from './seams/mirror-seams';
export { autoSeams, type AutoSeamOptions } from './seams/auto-seams';
export { cutAtCreases, CREASE_BORDER_DEG, CREASE_LINE_MIN_SHARE } from './seams/crease-borders';
export { splitPieces, type PieceMesh } from './pieces/split-pieces';
export { pieceLabel, pieceIndexOfLabel } from './pieces/label-pieces';
export { groupPieces, type PieceGroup, type PieceShape } from './pieces/group-pieces';
export { suggestDart } from './pieces/suggest-dart';

// Flattening.
export { flattenPiece, type FlatPiece, type FlattenOptions } from './flatten/flatten-piece';
export { triangleStretch } from './flatten/triangle-stretch';

// Bevels and thickness.
export { seamChains, type SeamChain } from './bevel/seam-chains';
export { seamBevel, bevelFromDihedralDeg, STATION_SPACING_MM, type SeamBevel, type BevelStation } from './bevel/seam-bevel';
export { offsetDirections, CREASE_SPREAD_DEG, MITRE_LIMIT } from './thickness/offset-directions';
export { offsetSurface, surfaceOffsetMm } from './thickness/offset-surface';
export { scoreLines, SCORE_LINE_MIN_FOLD_DEG } from './thickness/score-lines';

// The pattern pipeline and its document.
export type * from './pattern/pattern-doc';
export { preparePieces, type PreparedPieces, type PrepareOptions, type SeamSource } from './pattern/prepare-pieces';
export {
  buildPattern,
  patternFromPieces,
  DEFAULT_THICKNESS_MM,
  SHOP_CAUTIONS,
  type BuildPatternOptions,
} from './pattern/build-pattern';

// Sheet plans and the vector print sets (SVG, DXF).
export { planSheets, type SheetPlan, type PlanSheetsOptions, type Placement } from './layout/plan-sheets';
export { DEFAULT_STOCK_SHEETS, stockForThickness, type StockSheet } from './layout/stock-sheets';
export { pageSize, PAGE_SIZES_MM, type PageSizeName, type PageOrientation } from './export/page-sizes';
export { patternSvg } from './export/pattern-svg';
export { patternDxf } from './export/pattern-dxf';
