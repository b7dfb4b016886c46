/**
 * The one error type the engine throws. `code` is stable (tests and the UI switch on it);
 * `message` is for a person and says what is wrong and where; `line` (1-based, text formats)
 * and `face`/`vertex` (0-based indices) locate the problem when known.
 */
export type GeometryErrorCode =
  | 'EMPTY_FILE'
  | 'FILE_TOO_LARGE'
  | 'UNKNOWN_FORMAT'
  | 'BINARY_GARBAGE'
  | 'BAD_NUMBER'
  | 'NON_FINITE'
  | 'INDEX_OUT_OF_RANGE'
  | 'TOO_FEW_VERTICES'
  | 'FACE_TOO_SMALL'
  | 'TRUNCATED'
  | 'BAD_HEADER'
  | 'UNSUPPORTED'
  | 'TOO_MANY_TRIANGLES'
  | 'NO_FACES'
  | 'BAD_SEAM'
  | 'BAD_OPTION'
  | 'NOT_POSITIVE_DEFINITE'
  | 'NO_CONVERGENCE'
  | 'FLATTEN_FAILED'
  | 'LAYOUT_FAILED'
  | 'EXPORT_FAILED';

export interface GeometryErrorWhere {
  line?: number;
  face?: number;
  vertex?: number;
}

export class GeometryError extends Error {
  readonly code: GeometryErrorCode;
  readonly line?: number;
  readonly face?: number;
  readonly vertex?: number;

  constructor(code: GeometryErrorCode, message: string, where: GeometryErrorWhere = {}) {
    super(message);
    this.name = 'GeometryError';
    this.code = code;
    this.line = where.line;
    this.face = where.face;
    this.vertex = where.vertex;
  }
}

/** True when `e` is a GeometryError (also across module copies, by name and code). */
export function isGeometryError(e: unknown): e is GeometryError {
  return e instanceof GeometryError || (e instanceof Error && e.name === 'GeometryError' && 'code' in e);
}
