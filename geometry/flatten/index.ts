export { flattenPiece, type FlatPiece, type FlattenOptions } from './flatten-piece';
export { lscm, type LscmPins } from './lscm';
export { arapFlatten, type ArapOptions } from './arap';
export { triangleStretch, type TriangleStretch } from './triangle-stretch';
export { canonicalPose } from './canonical-pose';
export { cotanWeights } from './cotan-weights';
export { pieceTopology, type PieceTopology } from './piece-topology';
export { signedAreas } from './signed-area';
