// An accumulator of polynomial terms keyed by packed monomial keys (integers below 2^53)
// with coefficients held in doubles: open addressing, no allocation per term. Every sum
// and product is checked to stay a safe integer; callers redo the work with BigInt when
// `overflow` is set.

const MAX_SAFE = Number.MAX_SAFE_INTEGER;
const EMPTY = -1;

/** A table's arrays, kept for the next table once a table's result is taken. */
interface Storage {
  slots: Int32Array;
  slotKeys: Float64Array;
  keys: Float64Array;
  coefs: Float64Array;
}

// Fresh arrays of megabytes cost their allocation and a first touch of every page, and a table
// lives for one product only: finished tables give their arrays back. Two are kept (tables
// may be in use one inside another), the two largest.
const POOL: Storage[] = [];
const POOL_SIZE = 2;

function takeStorage(cap: number, n: number): Storage {
  const i = POOL.findIndex((s) => s.slots.length >= cap && s.keys.length >= n);
  if (i >= 0) return POOL.splice(i, 1)[0];
  return { slots: new Int32Array(cap), slotKeys: new Float64Array(cap), keys: new Float64Array(n), coefs: new Float64Array(n) };
}

function giveStorage(s: Storage): void {
  POOL.push(s);
  POOL.sort((a, b) => a.slots.length - b.slots.length);
  if (POOL.length > POOL_SIZE) POOL.shift();
}

export class TermTable {
  private slots: Int32Array; // slot -> term index, or EMPTY
  private slotKeys: Float64Array;
  private mask: number;
  keys: Float64Array;
  coefs: Float64Array;
  size = 0;
  overflow = false;

  constructor(expected: number) {
    let cap = 16;
    while (cap < expected * 2) cap *= 2;
    const storage = takeStorage(cap, Math.max(8, expected));
    // A pooled table may be larger than asked: the mask uses the slots asked for, the rest lie idle.
    this.slots = storage.slots;
    this.slots.fill(EMPTY, 0, cap);
    this.slotKeys = storage.slotKeys;
    this.mask = cap - 1;
    this.keys = storage.keys;
    this.coefs = storage.coefs;
  }

  private static hash(k: number): number {
    const lo = k >>> 0;
    const hi = (k / 4294967296) | 0;
    return Math.imul(lo ^ Math.imul(hi, 0x85ebca6b), 0x9e3779b1) ^ (lo >>> 15);
  }

  /** coefficient[key] += c; c must be a safe integer. */
  add(key: number, c: number): void {
    let s = TermTable.hash(key) & this.mask;
    for (;;) {
      const at = this.slots[s];
      if (at === EMPTY) break;
      if (this.slotKeys[s] === key) {
        const v = this.coefs[at] + c;
        if (v > MAX_SAFE || v < -MAX_SAFE) this.overflow = true;
        this.coefs[at] = v;
        return;
      }
      s = (s + 1) & this.mask;
    }
    if (this.size === this.keys.length) this.growTerms();
    this.slots[s] = this.size;
    this.slotKeys[s] = key;
    this.keys[this.size] = key;
    this.coefs[this.size] = c;
    this.size++;
    if (this.size * 2 > this.mask) this.rehash();
  }

  /** coefficient[key] += a * b. */
  addProduct(key: number, a: number, b: number): void {
    const p = a * b;
    if (p > MAX_SAFE || p < -MAX_SAFE) this.overflow = true;
    this.add(key, p);
  }

  private growTerms(): void {
    const n = this.keys.length * 2;
    const k = new Float64Array(n);
    k.set(this.keys);
    const c = new Float64Array(n);
    c.set(this.coefs);
    this.keys = k;
    this.coefs = c;
  }

  private rehash(): void {
    const cap = (this.mask + 1) * 2;
    if (this.slots.length < cap) {
      this.slots = new Int32Array(cap);
      this.slotKeys = new Float64Array(cap);
    }
    this.slots.fill(EMPTY, 0, cap);
    this.mask = cap - 1;
    for (let i = 0; i < this.size; i++) {
      const key = this.keys[i];
      let s = TermTable.hash(key) & this.mask;
      while (this.slots[s] !== EMPTY) s = (s + 1) & this.mask;
      this.slots[s] = i;
      this.slotKeys[s] = key;
    }
  }

  /** The nonzero terms, compacted; the table is finished (its arrays go to the next table). */
  result(): { keys: Float64Array; coefs: Float64Array } {
    let w = 0;
    const keys = new Float64Array(this.size);
    const coefs = new Float64Array(this.size);
    for (let i = 0; i < this.size; i++) {
      if (this.coefs[i] !== 0) {
        keys[w] = this.keys[i];
        coefs[w] = this.coefs[i];
        w++;
      }
    }
    giveStorage({ slots: this.slots, slotKeys: this.slotKeys, keys: this.keys, coefs: this.coefs });
    return { keys: keys.subarray(0, w), coefs: coefs.subarray(0, w) };
  }
}

/** Coefficients as doubles when every one is a safe integer of at most `limit` in magnitude, else null. */
export function smallCoefficients(coefs: readonly bigint[], limit = MAX_SAFE): Float64Array | null {
  const out = new Float64Array(coefs.length);
  const lim = BigInt(limit);
  for (let i = 0; i < coefs.length; i++) {
    const c = coefs[i];
    if (c > lim || c < -lim) return null;
    out[i] = Number(c);
  }
  return out;
}
