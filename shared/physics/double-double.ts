// Complex double-double numbers as a Field: each part is an unevaluated sum hi + lo of two
// doubles (Dekker, Numer. Math. 18 (1971) 224; Knuth's two-sum), about 32 significant digits.
// Used where double precision cancels too strongly (gravitons, the cubic scalar, Berends–Giele).
import { SingularError, intPow, type Field } from './field'

/** A complex double-double: re = rh + rl, im = ih + il. */
export interface DD {
  rh: number
  rl: number
  ih: number
  il: number
}

let H = 0
let L = 0
const SPLIT = 134217729 // 2^27 + 1

/** (H, L) = a·b exactly enough: Dekker's product with the cross terms of the low parts. */
function ddMul(ah: number, al: number, bh: number, bl: number): void {
  let t = SPLIT * ah
  const a1 = t - (t - ah)
  t = SPLIT * bh
  const b1 = t - (t - bh)
  splitMul(ah, a1, ah - a1, al, bh, b1, bh - b1, bl)
}

/** ddMul with the Dekker splits (a1 + a2 = ah, b1 + b2 = bh) given, for operands used twice. */
function splitMul(ah: number, a1: number, a2: number, al: number, bh: number, b1: number, b2: number, bl: number): void {
  const p = ah * bh
  const e = a1 * b1 - p + a1 * b2 + a2 * b1 + a2 * b2 + (ah * bl + al * bh)
  H = p + e
  L = e - (H - p)
}

/** (H, L) = a + b (Knuth's two-sum of the high parts, then the low parts). */
function ddAdd(ah: number, al: number, bh: number, bl: number): void {
  const s = ah + bh
  const bb = s - ah
  const e = ah - (s - bb) + (bh - bb) + al + bl
  H = s + e
  L = e - (H - s)
}

/** (H, L) = a / b: one Newton correction of the double quotient. */
function ddDiv(ah: number, al: number, bh: number, bl: number): void {
  const q1 = ah / bh
  ddMul(q1, 0, bh, bl)
  ddAdd(ah, al, -H, -L)
  const q2 = H / bh
  H = q1 + q2
  L = q2 - (H - q1)
}

export function ddOf(re: number, im: number): DD {
  return { rh: re, rl: 0, ih: im, il: 0 }
}

function ddC(rh: number, rl: number, ih: number, il: number): DD {
  return { rh, rl, ih, il }
}

function ddCAdd(x: DD, y: DD): DD {
  ddAdd(x.rh, x.rl, y.rh, y.rl)
  const rh = H, rl = L
  ddAdd(x.ih, x.il, y.ih, y.il)
  return ddC(rh, rl, H, L)
}

function ddCNeg(x: DD): DD {
  return ddC(-x.rh, -x.rl, -x.ih, -x.il)
}

function ddCSub(x: DD, y: DD): DD {
  ddAdd(x.rh, x.rl, -y.rh, -y.rl)
  const rh = H, rl = L
  ddAdd(x.ih, x.il, -y.ih, -y.il)
  return ddC(rh, rl, H, L)
}

function ddCMul(x: DD, y: DD): DD {
  // Each high part enters two products: split it once (the same bits as splitting it twice).
  let t = SPLIT * x.rh
  const xr1 = t - (t - x.rh), xr2 = x.rh - xr1
  t = SPLIT * x.ih
  const xi1 = t - (t - x.ih), xi2 = x.ih - xi1
  t = SPLIT * y.rh
  const yr1 = t - (t - y.rh), yr2 = y.rh - yr1
  t = SPLIT * y.ih
  const yi1 = t - (t - y.ih), yi2 = y.ih - yi1
  splitMul(x.rh, xr1, xr2, x.rl, y.rh, yr1, yr2, y.rl)
  const a1 = H, a2 = L
  splitMul(x.ih, xi1, xi2, x.il, y.ih, yi1, yi2, y.il)
  ddAdd(a1, a2, -H, -L)
  const rh = H, rl = L
  splitMul(x.rh, xr1, xr2, x.rl, y.ih, yi1, yi2, y.il)
  const b1 = H, b2 = L
  splitMul(x.ih, xi1, xi2, x.il, y.rh, yr1, yr2, y.rl)
  ddAdd(b1, b2, H, L)
  return ddC(rh, rl, H, L)
}

function ddCIsZero(x: DD): boolean {
  return x.rh === 0 && x.rl === 0 && x.ih === 0 && x.il === 0
}

function ddCInv(y: DD): DD {
  ddMul(y.rh, y.rl, y.rh, y.rl)
  const a1 = H, a2 = L
  ddMul(y.ih, y.il, y.ih, y.il)
  ddAdd(a1, a2, H, L)
  const dh = H, dl = L
  ddDiv(y.rh, y.rl, dh, dl)
  const rh = H, rl = L
  ddDiv(-y.ih, -y.il, dh, dl)
  return ddC(rh, rl, H, L)
}

const DD0 = ddOf(0, 0)
const DD1 = ddOf(1, 0)

/** Complex double-double arithmetic as a Field (kind float: it rounds, just much less). */
export const ddField: Field<DD> = {
  kind: 'float',
  zero: DD0,
  one: DD1,
  fromInt: (n) => ddOf(n, 0),
  add: ddCAdd,
  sub: ddCSub,
  mul: ddCMul,
  div: (a, b, what = 'division by zero') => {
    if (ddCIsZero(b)) throw new SingularError(what)
    return ddCMul(a, ddCInv(b))
  },
  neg: ddCNeg,
  pow: (a, k) => intPow(a, k, DD1, ddCMul, ddCInv, ddCIsZero),
  isZero: ddCIsZero,
  abs: (a) => Math.hypot(a.rh + a.rl, a.ih + a.il),
  equals: (a, b) => a.rh === b.rh && a.rl === b.rl && a.ih === b.ih && a.il === b.il,
  toWire: (a) => [a.rh + a.rl, a.ih + a.il],
  // ≈ 32 digits: the same headroom over rounding as doubles' 1e-10
  zeroTolerance: 1e-22,
}
