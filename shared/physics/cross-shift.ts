// The cross-shift check: the same amplitude under every [i,j⟩ shift. For a consistent theory all
// valid shifts agree; at n = 4 this is the four-particle test (Benincasa & Cachazo,
// arXiv:0705.4305; higher spins McGady & Rodina, arXiv:1311.2938 — references from memory):
// spin 1, 3, 4 without colour give different residue sums under different shifts.
import { Complex, SingularError, complexField, type Field } from './field'
import { ddField } from './double-double'
import { fromDoubleDouble, toDoubleDouble } from './kinematics'
import type { Kin } from './spinors'
import { bcfw } from './bcfw'
import { isValidShift, type Process } from './theories'

export interface CrossShiftRow<T> {
  /** 1-based. */
  shift: [number, number]
  valid: boolean
  /** Null when the shift meets a singular pole at this point. */
  value: T | null
}

export interface CrossShiftResult<T> {
  rows: CrossShiftRow<T>[]
  /** max |v_a − v_b| / max |v| over valid shifts (0 when fewer than two). */
  spread: number
  /** Every valid shift gives the same value (exactly, in exact arithmetic). */
  agree: boolean
}

export function crossShift<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], tolerance = 1e-9): CrossShiftResult<T> {
  if ((F as unknown) === complexField && p.theory !== 'gluon') {
    // gravitons, spin s and the cubic scalar in doubles: evaluate in double-double (see toDoubleDouble), report doubles
    const r = crossShift(ddField, p, toDoubleDouble(k as unknown as Kin<Complex>), h, tolerance)
    const rows = r.rows.map((x) => ({ ...x, value: x.value === null ? null : (fromDoubleDouble(x.value) as unknown as T) }))
    return { rows, spread: r.spread, agree: r.agree }
  }
  const n = h.length
  const rows: CrossShiftRow<T>[] = []
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    if (i === j) continue
    let value: T | null = null
    try {
      value = bcfw(F, p, k, h, [i, j]).value
    } catch (e) {
      if (!(e instanceof SingularError)) throw e
    }
    rows.push({ shift: [i + 1, j + 1], valid: isValidShift(p, h, i, j), value })
  }
  const vals = rows.filter((r) => r.valid && r.value !== null).map((r) => r.value as T)
  let spread = 0
  let exactAgree = true
  const scale = Math.max(0, ...vals.map((v) => F.abs(v)))
  for (let a = 0; a < vals.length; a++) for (let b = a + 1; b < vals.length; b++) {
    const d = F.sub(vals[a]!, vals[b]!)
    if (!F.isZero(d)) exactAgree = false
    if (scale > 0) spread = Math.max(spread, F.abs(d) / scale)
  }
  return { rows, spread, agree: F.kind === 'exact' ? exactAgree : spread <= tolerance }
}
