/**
 * Interval arithmetic with outward rounding (R. E. Moore, Interval Analysis, 1966; the
 * containment rules of the IEEE 1788-2015 standard): each operation returns an interval that
 * contains every exact result for operands taken in the operand intervals. Bounds are rounded
 * outward with `succ`/`pred` (./round.ts). The empty set is not represented: operations whose
 * domain is missed entirely (sqrt of a negative interval) return the whole line, which is always
 * a valid, if useless, enclosure; the certificate then reports the enclosure as too wide.
 *
 * sin and cos rely on the engine's Math.sin/Math.cos being accurate within one ulp (V8 and
 * SpiderMonkey use fdlibm with Payne–Hanek reduction); bounds are widened by four ulps and the
 * extrema ±1 are included whenever a critical point π/2 + kπ (sin) or kπ (cos) might lie
 * in the interval (decided with a safety margin, so never missed).
 */
import { pred, succ } from './round'

/** A closed interval [lo, hi] (lo ≤ hi; ±∞ allowed). */
export interface Interval { readonly lo: number; readonly hi: number }

/** The whole real line: the enclosure of last resort. */
export const ENTIRE: Interval = Object.freeze({ lo: -Infinity, hi: Infinity })

/** [lo, hi]; throws on lo > hi or NaN (an invalid interval is a programming error). */
export function interval(lo: number, hi = lo): Interval {
  if (!(lo <= hi)) throw new Error(`interval: invalid bounds [${lo}, ${hi}]`)
  return { lo, hi }
}

/** The point interval [x, x]. */
export function point(x: number): Interval { return interval(x, x) }

/** NaN-safe constructor for computed bounds: any NaN gives ENTIRE. */
function make(lo: number, hi: number): Interval {
  return lo <= hi ? { lo, hi } : ENTIRE
}

export function add(a: Interval, b: Interval): Interval { return make(pred(a.lo + b.lo), succ(a.hi + b.hi)) }
export function sub(a: Interval, b: Interval): Interval { return make(pred(a.lo - b.hi), succ(a.hi - b.lo)) }
export function neg(a: Interval): Interval { return { lo: -a.hi, hi: -a.lo } }

/** x·y with 0·∞ = 0 (an interval bound ∞ is a limit, and the product of limits with 0 is 0). */
function times(x: number, y: number): number { return x === 0 || y === 0 ? 0 : x * y }

export function mul(a: Interval, b: Interval): Interval {
  const p1 = times(a.lo, b.lo), p2 = times(a.lo, b.hi), p3 = times(a.hi, b.lo), p4 = times(a.hi, b.hi)
  return make(pred(Math.min(p1, p2, p3, p4)), succ(Math.max(p1, p2, p3, p4)))
}

/** Scalar multiple c·a for an exact double c. */
export function scale(c: number, a: Interval): Interval { return mul(point(c), a) }

/** a / b; a divisor containing 0 gives ENTIRE. */
export function div(a: Interval, b: Interval): Interval {
  if (b.lo <= 0 && b.hi >= 0) return ENTIRE
  const q1 = a.lo / b.lo, q2 = a.lo / b.hi, q3 = a.hi / b.lo, q4 = a.hi / b.hi
  return make(pred(Math.min(q1, q2, q3, q4)), succ(Math.max(q1, q2, q3, q4)))
}

/** a² (tighter than a·a when 0 ∈ a: never negative). */
export function sqr(a: Interval): Interval {
  const l = Math.abs(a.lo), h = Math.abs(a.hi)
  if (a.lo <= 0 && a.hi >= 0) return make(0, succ(Math.max(l, h) ** 2))
  const m = Math.min(l, h), M = Math.max(l, h)
  return make(Math.max(0, pred(m * m)), succ(M * M))
}

/** √a over the part of a in [0, ∞); ENTIRE when a lies wholly below 0. */
export function sqrt(a: Interval): Interval {
  if (a.hi < 0) return ENTIRE
  return make(a.lo <= 0 ? 0 : Math.max(0, pred(Math.sqrt(a.lo))), succ(Math.sqrt(a.hi)))
}

/** √(x² + y²). */
export function hypot(x: Interval, y: Interval): Interval { return sqrt(add(sqr(x), sqr(y))) }

/** Bound widened by four ulps outward (engine sin/cos: within one ulp). */
function down4(x: number): number { return pred(pred(pred(pred(x)))) }
function up4(x: number): number { return succ(succ(succ(succ(x)))) }

/**
 * Range of f over [a, b] where f ∈ {sin, cos} has its extrema at offset + kπ with value (−1)^k.
 */
function trig(a: Interval, f: (x: number) => number, offset: number): Interval {
  if (!Number.isFinite(a.lo) || !Number.isFinite(a.hi) || a.hi - a.lo >= 6) return interval(-1, 1)
  const fa = f(a.lo), fb = f(a.hi)
  let lo = Math.max(-1, down4(Math.min(fa, fb)))
  let hi = Math.min(1, up4(Math.max(fa, fb)))
  // k with a.lo ≤ offset + kπ ≤ a.hi, widened by a margin that covers every rounding in t(x)
  const t = (x: number) => (x - offset) / Math.PI
  const margin = 1e-9 * (1 + Math.abs(a.lo) + Math.abs(a.hi))
  const k0 = Math.ceil(t(a.lo) - margin), k1 = Math.floor(t(a.hi) + margin)
  if (k1 > k0) return interval(-1, 1) // a maximum and a minimum may both lie inside
  if (k1 === k0) {
    if (Math.abs(k0) % 2 === 0) hi = 1
    else lo = -1
  }
  return make(lo, hi)
}

export function sin(a: Interval): Interval { return trig(a, Math.sin, Math.PI / 2) }
export function cos(a: Interval): Interval { return trig(a, Math.cos, 0) }

/** f(x, s) = x / √(x² + s²) for an exact point (x, s), enclosed. */
function unitComponent(x: number, s: number): Interval {
  return div(point(x), hypot(point(x), point(s)))
}

/**
 * The unit vector (x, y)/|(x, y)| over a box, each component to its exact range up to rounding:
 * u_x = x/√(x² + y²) increases in x and, for fixed x, moves away from ±1 as |y| grows, so its
 * extremes sit at corners of the box in (x, |y|) (derived from ∂u_x/∂x = y²/|·|³ ≥ 0 and
 * ∂u_x/∂|y| = −x|y|/|·|³). A box touching the origin gives [−1, 1]².
 */
export function unitVector(x: Interval, y: Interval): [Interval, Interval] {
  if (x.lo <= 0 && x.hi >= 0 && y.lo <= 0 && y.hi >= 0) return [interval(-1, 1), interval(-1, 1)]
  return [unitRange(x, y), unitRange(y, x)]
}

/** Range of the first component of the unit vector over the box x × y (not touching 0). */
function unitRange(x: Interval, y: Interval): Interval {
  const aMin = y.lo <= 0 && y.hi >= 0 ? 0 : Math.min(Math.abs(y.lo), Math.abs(y.hi))
  const aMax = Math.max(Math.abs(y.lo), Math.abs(y.hi))
  const hiAt = x.hi > 0 ? unitComponent(x.hi, aMin) : unitComponent(x.hi, aMax)
  const loAt = x.lo >= 0 ? unitComponent(x.lo, aMax) : unitComponent(x.lo, aMin)
  return make(Math.max(-1, loAt.lo), Math.min(1, hiAt.hi))
}

/** Convex hull of two intervals. */
export function hull(a: Interval, b: Interval): Interval { return { lo: Math.min(a.lo, b.lo), hi: Math.max(a.hi, b.hi) } }

/** True when x lies in a. */
export function contains(a: Interval, x: number): boolean { return a.lo <= x && x <= a.hi }

/** Magnitude max |x| over a. */
export function mag(a: Interval): number { return Math.max(Math.abs(a.lo), Math.abs(a.hi)) }

/** Width hi − lo, rounded up. */
export function width(a: Interval): number { return succ(a.hi - a.lo) }

/** Midpoint (a double inside a for finite bounds). */
export function midpoint(a: Interval): number {
  const m = 0.5 * a.lo + 0.5 * a.hi
  return Math.min(a.hi, Math.max(a.lo, m))
}
