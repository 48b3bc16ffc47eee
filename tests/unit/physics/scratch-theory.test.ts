import { describe, expect, it } from 'vitest'
import { evaluate } from '#shared/physics/index'

describe('scratch theory', () => {
  it('spin-three equals spin with s = 3', () => {
    const a = evaluate({ theory: 'spin-three', helicities: [-3, -3, 3, 3], kinematics: { kind: 'random', seed: 3 }, target: 'none' } as any)
    const b = evaluate({ theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], kinematics: { kind: 'random', seed: 3 }, target: 'none' } as any)
    console.log(JSON.stringify(a).slice(0, 300)); expect(a.value).toBeDefined(); expect(a.value).toEqual(b.value)
  })
})
