// A PhysicsError that escapes a route becomes a 422 naming its field (OWASP ASVS 4.0 V7.4.1: a
// generic, safe error with the field, never "Server Error").
import { describe, expect, it } from 'vitest'
import { createError } from 'h3'
import { PhysicsError } from '#shared/physics/errors'

describe('V7.4.1 PhysicsError through h3', () => {
  it('keeps 422, the reason phrase and data.field', () => {
    const e = createError(new PhysicsError('kinematics.seed', 'no point found'))
    expect(e.statusCode).toBe(422)
    expect(e.statusMessage).toBe('Unprocessable Entity')
    expect(e.data).toEqual({ field: 'kinematics.seed' })
    expect(e.message).toBe('kinematics.seed: no point found')
  })
})
