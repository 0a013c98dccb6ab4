// Exact rationals over BigInt, always normalized: gcd(num, den) = 1 and den > 0.

export function bigAbs(a: bigint): bigint {
  return a < 0n ? -a : a;
}

const SAFE = BigInt(Number.MAX_SAFE_INTEGER);

/** Greatest common divisor of two integers, non-negative; gcd(0, 0) = 0. */
export function bigGcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  // Small operands: Euclid in doubles is exact below 2^53 and far cheaper than BigInt steps.
  if (a <= SAFE && b <= SAFE) {
    let x = Number(a);
    let y = Number(b);
    while (y !== 0) {
      const t = x % y;
      x = y;
      y = t;
    }
    return BigInt(x);
  }
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

export function bigLcm(a: bigint, b: bigint): bigint {
  if (a === 0n || b === 0n) return 0n;
  return bigAbs((a / bigGcd(a, b)) * b);
}

function toBigInt(x: bigint | number, what: string): bigint {
  if (typeof x === "bigint") return x;
  if (!Number.isInteger(x)) throw new RangeError(`${what} must be an integer, got ${x}`);
  return BigInt(x);
}

export class Rational {
  readonly num: bigint;
  readonly den: bigint;

  private constructor(num: bigint, den: bigint) {
    this.num = num;
    this.den = den;
  }

  static readonly ZERO: Rational = new Rational(0n, 1n);
  static readonly ONE: Rational = new Rational(1n, 1n);

  static of(num: bigint | number, den: bigint | number = 1n): Rational {
    let n = toBigInt(num, "numerator");
    let d = toBigInt(den, "denominator");
    if (d === 0n) throw new RangeError("Rational with zero denominator");
    if (d < 0n) {
      n = -n;
      d = -d;
    }
    if (d === 1n) return new Rational(n, 1n);
    const g = bigGcd(n, d);
    return g === 1n ? new Rational(n, d) : new Rational(n / g, d / g);
  }

  /** Exact value of a decimal literal: "4.7", "-1e-3", "2.2E6", ".5", "3." */
  static parseDecimal(text: string): Rational {
    const m = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(text.trim());
    if (!m || (m[2] === "" && (m[3] ?? "") === "")) throw new SyntaxError(`not a decimal number: "${text}"`);
    const intPart = m[2];
    const frac = m[3] ?? "";
    const exp = m[4] ? Number(m[4]) : 0;
    if (!Number.isSafeInteger(exp) || Math.abs(exp) > 100000) throw new RangeError(`exponent out of range: "${text}"`);
    let num = BigInt((intPart || "0") + frac);
    if (m[1] === "-") num = -num;
    const scale = exp - frac.length;
    return scale >= 0 ? Rational.of(num * 10n ** BigInt(scale)) : Rational.of(num, 10n ** BigInt(-scale));
  }

  add(o: Rational): Rational {
    if (this.den === 1n && o.den === 1n) return new Rational(this.num + o.num, 1n);
    return Rational.of(this.num * o.den + o.num * this.den, this.den * o.den);
  }

  sub(o: Rational): Rational {
    if (this.den === 1n && o.den === 1n) return new Rational(this.num - o.num, 1n);
    return Rational.of(this.num * o.den - o.num * this.den, this.den * o.den);
  }

  mul(o: Rational): Rational {
    if (this.den === 1n && o.den === 1n) return new Rational(this.num * o.num, 1n);
    return Rational.of(this.num * o.num, this.den * o.den);
  }

  div(o: Rational): Rational {
    if (o.num === 0n) throw new RangeError("division by zero");
    return Rational.of(this.num * o.den, this.den * o.num);
  }

  neg(): Rational {
    return new Rational(-this.num, this.den);
  }

  inverse(): Rational {
    if (this.num === 0n) throw new RangeError("inverse of zero");
    return Rational.of(this.den, this.num);
  }

  abs(): Rational {
    return this.num < 0n ? this.neg() : this;
  }

  pow(n: number): Rational {
    if (!Number.isInteger(n)) throw new RangeError("integer exponent required");
    if (n < 0) return this.inverse().pow(-n);
    const e = BigInt(n);
    return new Rational(this.num ** e, this.den ** e);
  }

  isZero(): boolean {
    return this.num === 0n;
  }

  isOne(): boolean {
    return this.num === 1n && this.den === 1n;
  }

  isInteger(): boolean {
    return this.den === 1n;
  }

  sign(): -1 | 0 | 1 {
    return this.num > 0n ? 1 : this.num < 0n ? -1 : 0;
  }

  equals(o: Rational): boolean {
    return this.num === o.num && this.den === o.den;
  }

  compare(o: Rational): number {
    const d = this.num * o.den - o.num * this.den;
    return d > 0n ? 1 : d < 0n ? -1 : 0;
  }

  toNumber(): number {
    if (this.den === 1n) return Number(this.num);
    const n = Number(this.num);
    const d = Number(this.den);
    if (Number.isFinite(n) && Number.isFinite(d)) return n / d;
    // Huge parts: scale down both by the same power of two before converting.
    const shift = BigInt(Math.max(this.num.toString(2).length, this.den.toString(2).length) - 1000);
    return Number(this.num >> shift) / Number(this.den >> shift);
  }

  toString(): string {
    return this.den === 1n ? this.num.toString() : `${this.num}/${this.den}`;
  }
}
