/**
 * Every interval primitive against decimal.js at 60 significant digits (a general-purpose
 * arbitrary-precision library, the outside reference): on seeded random operands the enclosure
 * must contain the high-precision value of the operation at points drawn inside the operand
 * intervals (their end points included), and on the hard cases (0 in a divisor, huge and tiny
 * magnitudes, cos at ±π/2, sin at multiples of π).
 */
import Decimal from 'decimal.js'
import { describe, expect, it } from 'vitest'
import {
  add, cos, div, hypot, interval, mul, point, sin, sqr, sqrt, sub, unitVector, type Interval,
} from '../../../shared/certify/interval'
import { pred, succ } from '../../../shared/certify/round'
import { seeded } from '../linalg/random'

const D = Decimal.clone({ precision: 60 })

/**
 * Decimal value of a double from its binary form m·2^e (decimal.js reads a number through its
 * shortest decimal string, which is not the double's value: 1.5707963267948966 ≠ the double
 * nearest π/2). Correct to 60 digits, far inside the one-ulp outward margin.
 */
function dec(x: number): Decimal {
  let m = x, e = 0
  while (!Number.isInteger(m)) { m *= 2; e-- }
  return new D(BigInt(m).toString()).times(new D(2).pow(e))
}

/** lo ≤ v ≤ hi in exact decimal comparison. */
function encloses(a: Interval, v: Decimal): boolean {
  return (a.lo === -Infinity || dec(a.lo).lte(v)) && (a.hi === Infinity || dec(a.hi).gte(v))
}

/** A random double with a random binary exponent in [−e, e] and random sign. */
function randomDouble(rnd: () => number, e: number): number {
  return (rnd() < 0.5 ? -1 : 1) * (1 + rnd()) * 2 ** Math.round((2 * rnd() - 1) * e)
}

/** A random interval around a random double, width up to 10 % (or a point). */
function randomInterval(rnd: () => number, e: number): Interval {
  const x = randomDouble(rnd, e)
  if (rnd() < 0.3) return point(x)
  const w = Math.abs(x) * 0.1 * rnd()
  return interval(x - w, x + w)
}

/** Sample points of an interval: both ends and a few inside. */
function samples(a: Interval, rnd: () => number): number[] {
  return [a.lo, a.hi, a.lo + (a.hi - a.lo) * rnd(), a.lo + (a.hi - a.lo) * rnd()]
}

const binary: [string, (a: Interval, b: Interval) => Interval, (x: Decimal, y: Decimal) => Decimal][] = [
  ['add', add, (x, y) => x.plus(y)],
  ['sub', sub, (x, y) => x.minus(y)],
  ['mul', mul, (x, y) => x.times(y)],
  ['div', div, (x, y) => x.div(y)],
  ['hypot', hypot, (x, y) => x.times(x).plus(y.times(y)).sqrt()],
]

const unary: [string, (a: Interval) => Interval, (x: Decimal) => Decimal, number][] = [
  ['sqr', sqr, x => x.times(x), 60],
  ['sqrt', a => sqrt(interval(Math.abs(a.lo) < Math.abs(a.hi) ? Math.abs(a.lo) : Math.abs(a.hi), Math.max(Math.abs(a.lo), Math.abs(a.hi)))), x => x.abs().sqrt(), 300],
  ['sin', sin, x => D.sin(x), 8],
  ['cos', cos, x => D.cos(x), 8],
]

describe('interval primitives contain the decimal.js value (seeded random operands)', () => {
  for (const [name, f, ref] of binary) {
    it(name, () => {
      const rnd = seeded(1000 + name.length)
      for (let k = 0; k < 400; k++) {
        const e = k < 200 ? 10 : 300
        const a = randomInterval(rnd, e), b = randomInterval(rnd, e)
        const r = f(a, b)
        for (const x of samples(a, rnd)) for (const y of samples(b, rnd)) {
          expect(encloses(r, ref(dec(x), dec(y))), `${name}(${x}, ${y}) in [${r.lo}, ${r.hi}]`).toBe(true)
        }
      }
    })
  }
  for (const [name, f, ref, e] of unary) {
    it(name, () => {
      const rnd = seeded(2000 + name.length)
      for (let k = 0; k < 600; k++) {
        const a = randomInterval(rnd, e)
        const r = f(a)
        const pts = name === 'sqrt' ? samples(a, rnd).map(Math.abs).filter(x => x >= Math.min(Math.abs(a.lo), Math.abs(a.hi))) : samples(a, rnd)
        for (const x of pts) expect(encloses(r, ref(dec(x))), `${name}(${x}) in [${r.lo}, ${r.hi}]`).toBe(true)
      }
    })
  }
  it('unit vector x/|x| on boxes', () => {
    const rnd = seeded(77)
    for (let k = 0; k < 400; k++) {
      const X = randomInterval(rnd, 6), Y = randomInterval(rnd, 6)
      const [ux, uy] = unitVector(X, Y)
      for (const x of samples(X, rnd)) for (const y of samples(Y, rnd)) {
        const n = dec(x).times(x).plus(dec(y).times(y)).sqrt()
        expect(encloses(ux, dec(x).div(n))).toBe(true)
        expect(encloses(uy, dec(y).div(n))).toBe(true)
      }
    }
  })
  // S. M. Rump, P. Zimmermann, S. Boldo, G. Melquiond, "Computing predecessor and successor in
  // rounding to nearest", BIT Numerical Mathematics 49, 2009 (from memory)
  it('succ and pred move outward by at least one double (Rump et al. 2009)', () => {
    const rnd = seeded(5)
    for (let k = 0; k < 2000; k++) {
      const x = randomDouble(rnd, 1020)
      expect(dec(succ(x)).gt(dec(x))).toBe(true)
      expect(dec(pred(x)).lt(dec(x))).toBe(true)
    }
    expect(succ(0)).toBeGreaterThan(0)
    expect(pred(Number.MIN_VALUE)).toBeLessThan(Number.MIN_VALUE)
    expect(succ(Number.MAX_VALUE)).toBe(Infinity)
  })
})

describe('hard cases', () => {
  it('a divisor containing 0 gives the whole line', () => {
    const r = div(point(1), interval(-1e-300, 2))
    expect(r.lo).toBe(-Infinity)
    expect(r.hi).toBe(Infinity)
    expect(div(point(1), interval(0, 1)).hi).toBe(Infinity)
  })
  it('huge and tiny magnitudes', () => {
    const big = mul(point(1e308), point(10))
    expect(big.hi).toBe(Infinity)
    expect(encloses(big, dec(1e308).times(10))).toBe(true)
    const tiny = mul(point(1e-300), point(1e-300)) // underflows to 0 in floating point
    expect(tiny.lo).toBeLessThan(0)
    expect(tiny.hi).toBeGreaterThan(0)
    expect(encloses(tiny, dec(1e-300).times(dec(1e-300)))).toBe(true)
    const sub5 = sub(point(5e-324), point(-5e-324))
    expect(encloses(sub5, dec(5e-324).times(2))).toBe(true)
    const h = hypot(point(1e200), point(1e200)) // the squares overflow
    expect(encloses(h, dec(1e200).times(D.sqrt(2)))).toBe(true)
  })
  it('cos at ±π/2 (the double nearest π/2 lies below π/2) and sin at multiples of π', () => {
    for (const x of [Math.PI / 2, -Math.PI / 2, 3 * Math.PI / 2, 1e6 * Math.PI + Math.PI / 2]) {
      const r = cos(point(x))
      expect(encloses(r, D.cos(dec(x))), `cos(${x})`).toBe(true)
      expect(Math.abs(r.hi - r.lo)).toBeLessThan(1e-9)
    }
    for (const x of [Math.PI, -Math.PI, 1e10 * Math.PI, 2 ** 60]) {
      expect(encloses(sin(point(x)), D.sin(dec(x))), `sin(${x})`).toBe(true)
    }
    // an interval around π/2 reaches the maximum of sin and brackets 0 for cos
    const s = sin(interval(1.5, 1.6))
    expect(s.hi).toBe(1)
    const c = cos(interval(1.5, 1.6))
    expect(c.lo).toBeLessThan(0)
    expect(c.hi).toBeGreaterThan(0)
    expect(cos(interval(-0.1, 0.1)).hi).toBe(1)
    expect(sin(interval(0, 7))).toEqual({ lo: -1, hi: 1 })
  })
  it('0·∞ bounds give 0, not NaN', () => {
    const r = mul(interval(0, 1), interval(0, Infinity))
    expect(r.lo).toBeLessThanOrEqual(0)
    expect(r.hi).toBe(Infinity)
  })
})
