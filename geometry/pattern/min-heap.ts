/**
 * Binary min-heap of (item, key) pairs for Dijkstra searches over mesh elements. Deletion is lazy: a caller
 * pushes an item again with a smaller key and skips stale pops.
 */
export class MinHeap {
  private items: Int32Array;
  private keys: Float64Array;
  size = 0;

  constructor(capacity: number) {
    this.items = new Int32Array(Math.max(4, capacity));
    this.keys = new Float64Array(Math.max(4, capacity));
  }

  /** Adds `item` (an integer) with priority `key`. */
  push(item: number, key: number): void {
    if (this.size === this.items.length) {
      const items = new Int32Array(this.size * 2);
      const keys = new Float64Array(this.size * 2);
      items.set(this.items);
      keys.set(this.keys);
      this.items = items;
      this.keys = keys;
    }
    let i = this.size++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (this.keys[p] <= key) break;
      this.items[i] = this.items[p];
      this.keys[i] = this.keys[p];
      i = p;
    }
    this.items[i] = item;
    this.keys[i] = key;
  }

  /** Removes and returns the item with the smallest key; the heap must not be empty. */
  pop(): number {
    const top = this.items[0];
    const lastItem = this.items[--this.size];
    const lastKey = this.keys[this.size];
    let i = 0;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= this.size) break;
      if (c + 1 < this.size && this.keys[c + 1] < this.keys[c]) c++;
      if (this.keys[c] >= lastKey) break;
      this.items[i] = this.items[c];
      this.keys[i] = this.keys[c];
      i = c;
    }
    this.items[i] = lastItem;
    this.keys[i] = lastKey;
    return top;
  }
}
