/**
 * Append-only typed-array buffers that double their capacity, so the parsers never hold numbers in plain JS
 * arrays (which cost ~4× the memory and a copy at the end).
 */
export class GrowableFloat64 {
  data: Float64Array;
  length = 0;

  constructor(capacity = 1024) {
    this.data = new Float64Array(Math.max(16, capacity));
  }

  /** Appends one number. */
  push(x: number): void {
    if (this.length === this.data.length) this.grow();
    this.data[this.length++] = x;
  }

  /** Appends three numbers (one point). */
  push3(x: number, y: number, z: number): void {
    if (this.length + 3 > this.data.length) this.grow();
    const d = this.data;
    const n = this.length;
    d[n] = x;
    d[n + 1] = y;
    d[n + 2] = z;
    this.length = n + 3;
  }

  private grow(): void {
    const next = new Float64Array(this.data.length * 2);
    next.set(this.data);
    this.data = next;
  }

  /** Returns a right-sized copy of the contents. */
  toArray(): Float64Array {
    return this.data.slice(0, this.length);
  }
}

/** Append-only Uint32Array buffer (see GrowableFloat64). */
export class GrowableUint32 {
  data: Uint32Array;
  length = 0;

  constructor(capacity = 1024) {
    this.data = new Uint32Array(Math.max(16, capacity));
  }

  /** Appends one index. */
  push(x: number): void {
    if (this.length === this.data.length) this.grow();
    this.data[this.length++] = x;
  }

  /** Appends three indices (one triangle). */
  push3(a: number, b: number, c: number): void {
    if (this.length + 3 > this.data.length) this.grow();
    const d = this.data;
    const n = this.length;
    d[n] = a;
    d[n + 1] = b;
    d[n + 2] = c;
    this.length = n + 3;
  }

  private grow(): void {
    const next = new Uint32Array(this.data.length * 2);
    next.set(this.data);
    this.data = next;
  }

  /** Returns a right-sized copy of the contents. */
  toArray(): Uint32Array {
    return this.data.slice(0, this.length);
  }
}

/** Append-only Int32Array buffer (see GrowableFloat64); used where −1 means "absent". */
export class GrowableInt32 {
  data: Int32Array;
  length = 0;

  constructor(capacity = 1024) {
    this.data = new Int32Array(Math.max(16, capacity));
  }

  /** Appends one value. */
  push(x: number): void {
    if (this.length === this.data.length) {
      const next = new Int32Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = x;
  }

  /** Returns a right-sized copy of the contents. */
  toArray(): Int32Array {
    return this.data.slice(0, this.length);
  }
}
