import { GeometryError } from '../errors';

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];

const SPACE = 32;
const TAB = 9;
const CR = 13;
const LF = 10;
const BACKSLASH = 92;
const HASH = 35;

/** Result of `scanNumber` when the token is not a number at all. */
export const NOT_A_NUMBER = Symbol('not a number');

/**
 * A cursor over the bytes of a text model file (ASCII/UTF-8) that reads numbers and words in place, with no
 * per-line strings and no regular expressions, and keeps a 1-based line number for error messages.
 * Statements end at a line feed; a backslash right before the line end continues the statement on the next
 * line (OBJ convention); `#` starts a comment when `hashComments` is set.
 */
export class TextScanner {
  readonly bytes: Uint8Array;
  pos = 0;
  line = 1;
  readonly end: number;
  private readonly hashComments: boolean;
  private readonly what: string;

  constructor(bytes: Uint8Array, what: string, hashComments: boolean, start = 0) {
    this.bytes = bytes;
    this.end = bytes.length;
    this.pos = start;
    this.what = what;
    this.hashComments = hashComments;
  }

  /** Skips spaces, tabs, carriage returns and backslash line continuations (counting their lines). */
  skipInlineSpace(): void {
    const b = this.bytes;
    let p = this.pos;
    for (;;) {
      const c = b[p];
      if (c === SPACE || c === TAB || c === CR) p++;
      else if (c === BACKSLASH && (b[p + 1] === LF || (b[p + 1] === CR && b[p + 2] === LF))) {
        p += b[p + 1] === LF ? 2 : 3;
        this.line++;
      } else break;
    }
    this.pos = p;
  }

  /** True when the statement has ended: end of file, a line feed, or a comment. Call after skipInlineSpace. */
  atStatementEnd(): boolean {
    const c = this.bytes[this.pos];
    return this.pos >= this.end || c === LF || (this.hashComments && c === HASH);
  }

  /** Moves past the end of the current line, continuation backslashes included (comments, unknown keywords). */
  skipLine(): void {
    const b = this.bytes;
    let p = this.pos;
    const end = this.end;
    while (p < end && b[p] !== LF) p++;
    if (p < end) {
      p++;
      this.line++;
    }
    this.pos = p;
  }

  /** Moves past the rest of the statement (continuation lines included), then past its line feed. */
  skipStatement(): void {
    const b = this.bytes;
    while (this.pos < this.end) {
      const c = b[this.pos];
      if (c === LF) {
        this.pos++;
        this.line++;
        return;
      }
      if (c === BACKSLASH) {
        const before = this.line;
        this.skipInlineSpace();
        if (this.line !== before) continue;
      }
      this.pos++;
    }
  }

  /** Returns the bytes of the next whitespace-delimited word as a string (for keywords and names). */
  word(): string {
    const b = this.bytes;
    const s = this.pos;
    let p = s;
    while (p < this.end) {
      const c = b[p];
      if (c === SPACE || c === TAB || c === CR || c === LF) break;
      p++;
    }
    this.pos = p;
    return latin1(b, s, p);
  }

  /** Returns the rest of the statement, trimmed, decoded as UTF-8 (a group or object name). */
  restOfStatement(): string {
    const b = this.bytes;
    const s = this.pos;
    let p = s;
    while (p < this.end && b[p] !== LF && !(this.hashComments && b[p] === HASH)) p++;
    this.pos = p;
    return new TextDecoder('utf-8', { fatal: false }).decode(b.subarray(s, p)).replace(/\\\r?\n/g, ' ').trim();
  }

  /**
   * Reads a decimal number at the cursor and returns it. Uses the exact fast path (≤ 15 significant digits
   * and |exponent| ≤ 22: one correctly rounded IEEE multiply or divide, Clinger 1990, "How to read floating
   * point numbers accurately"), else falls back to Number() on the token, so results equal parseFloat's.
   * Throws GeometryError BAD_NUMBER (malformed) or NON_FINITE (nan, inf, overflow) with the line number.
   */
  number(what: string): number {
    const b = this.bytes;
    const start = this.pos;
    let p = start;
    let negative = false;
    if (b[p] === 45) {
      negative = true;
      p++;
    } else if (b[p] === 43) p++;
    let mant = 0;
    let digits = 0;
    let sawDigit = false;
    let exp = 0;
    let c = b[p];
    while (c >= 48 && c <= 57) {
      sawDigit = true;
      if (digits > 0 || c !== 48) {
        mant = mant * 10 + (c - 48);
        digits++;
      }
      c = b[++p];
    }
    if (c === 46) {
      c = b[++p];
      while (c >= 48 && c <= 57) {
        sawDigit = true;
        if (digits > 0 || c !== 48) {
          mant = mant * 10 + (c - 48);
          digits++;
        }
        exp--;
        c = b[++p];
      }
    }
    if (sawDigit && (c === 101 || c === 69)) {
      let q = p + 1;
      let eneg = false;
      if (b[q] === 45) {
        eneg = true;
        q++;
      } else if (b[q] === 43) q++;
      let e = 0;
      let sawE = false;
      while (b[q] >= 48 && b[q] <= 57) {
        if (e < 100000) e = e * 10 + (b[q] - 48);
        sawE = true;
        q++;
      }
      if (!sawE) this.fail('BAD_NUMBER', start, what);
      exp += eneg ? -e : e;
      p = q;
      c = b[p];
    }
    if (!sawDigit || !(p >= this.end || c === SPACE || c === TAB || c === CR || c === LF || c === 47 || c === BACKSLASH || (this.hashComments && c === HASH))) {
      this.fail('BAD_NUMBER', start, what);
    }
    this.pos = p;
    let value: number;
    if (digits <= 15 && exp >= -22 && exp <= 22) {
      value = exp >= 0 ? mant * POW10[exp] : mant / POW10[-exp];
    } else {
      value = Number(latin1(b, start + (negative || b[start] === 43 ? 1 : 0), p));
    }
    if (!Number.isFinite(value)) this.fail('NON_FINITE', start, what);
    return negative ? -value : value;
  }

  /** Reads a decimal integer (optionally signed). Throws BAD_NUMBER with the line when there is none. */
  integer(what: string): number {
    const b = this.bytes;
    const start = this.pos;
    let p = start;
    let negative = false;
    if (b[p] === 45) {
      negative = true;
      p++;
    } else if (b[p] === 43) p++;
    let v = 0;
    const first = p;
    while (b[p] >= 48 && b[p] <= 57) {
      v = v * 10 + (b[p] - 48);
      p++;
    }
    if (p === first || v > 2 ** 52) this.fail('BAD_NUMBER', start, what);
    this.pos = p;
    return negative ? -v : v;
  }

  /** Throws the GeometryError for a bad token at byte `start`, quoting the token and the line. */
  fail(code: 'BAD_NUMBER' | 'NON_FINITE', start: number, what: string): never {
    const b = this.bytes;
    let p = start;
    while (p < this.end && p - start < 40 && b[p] !== SPACE && b[p] !== TAB && b[p] !== CR && b[p] !== LF) p++;
    for (let i = start; i <= p && i < this.end; i++) {
      if (b[i] < 32 && b[i] !== TAB && b[i] !== CR && b[i] !== LF && b[i] !== 12) {
        throw new GeometryError('BINARY_GARBAGE', `${this.what} line ${this.line}: the file contains binary data where a number should be`, { line: this.line });
      }
    }
    const token = latin1(b, start, p);
    if (/^[+-]?(nan|inf|infinity)$/i.test(token)) code = 'NON_FINITE';
    const problem = code === 'NON_FINITE' ? 'is not a finite number' : 'is not a number';
    throw new GeometryError(
      code,
      `${this.what} line ${this.line}: ${what} "${token}" ${problem}`,
      { line: this.line },
    );
  }
}

/** Decodes bytes [s, e) one byte per character (enough for numbers and keywords). */
export function latin1(b: Uint8Array, s: number, e: number): string {
  let out = '';
  for (let i = s; i < e; i += 4096) out += String.fromCharCode(...b.subarray(i, Math.min(e, i + 4096)));
  return out;
}

/** Returns the 1-based line number of byte offset `pos` (counts line feeds before it; error path only). */
export function lineOfOffset(bytes: Uint8Array, pos: number): number {
  let line = 1;
  for (let i = 0; i < pos && i < bytes.length; i++) if (bytes[i] === LF) line++;
  return line;
}
