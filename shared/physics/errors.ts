// Physics-invalid input (422, docs/api.md "Errors"). The message starts with the field path so the route can
// pass it through unchanged; `field` carries the same path for `data.field`.
export class PhysicsError extends Error {
  readonly status = 422
  // Read by h3 when a PhysicsError escapes a route: it becomes a 422 naming the field, never a bare error.
  readonly statusCode = 422
  readonly statusMessage = 'Unprocessable Entity'
  get data() {
    return { field: this.field }
  }

  constructor(
    public readonly field: string,
    reason: string,
  ) {
    // A reason that already starts with the path is kept as it is (no doubled prefix).
    super(!field || reason.startsWith(field) ? reason : `${field}: ${reason}`)
    this.name = 'PhysicsError'
  }
}

/** Short scientific notation for sizes quoted in messages (e.g. 3.2e-3). */
export function fmtSize(x: number): string {
  if (x === 0) return '0'
  const a = Math.abs(x)
  if (a >= 1e-3 && a < 1e4) return String(Number(x.toPrecision(3)))
  const [m, e] = x.toExponential(1).split('e')
  return `${m}e${Number(e)}`
}
