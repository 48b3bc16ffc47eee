// The password strength rule (server/utils/passwords.ts): zxcvbn-ts with its common dictionary.
import { describe, expect, it } from 'vitest'
import { passwordWeakness } from '../../../server/utils/passwords'
import { DEMO_PASSWORD } from '../../../server/utils/seed'

describe('passwordWeakness', () => {
  it.each(['password', '12345678', 'qwertyuiop', 'iloveyou', 'password1', 'aaaaaaaaaa', 'abcdefgh'])('refuses the common %j', (p) => {
    expect(passwordWeakness(p)).toMatch(/^is too easy to guess/)
  })

  it('refuses spaces only', () => {
    expect(passwordWeakness('        ')).toBe('is only spaces')
  })

  it('counts the account\'s own name and address as guessable', () => {
    expect(passwordWeakness('quentinmarlowe')).toBeNull()
    expect(passwordWeakness('quentinmarlowe', ['quentin.marlowe@example.test', 'Quentin Marlowe'])).toMatch(/your name or e-mail address/)
  })

  it('accepts the demo and test passwords and a phrase of unrelated words', () => {
    for (const p of [DEMO_PASSWORD, 'correct-horse-1', 'long-enough-1', 'brand-new-secret-2', 'tensor-quiver-58']) expect(passwordWeakness(p)).toBeNull()
  })
})
