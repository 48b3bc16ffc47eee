// Password strength: zxcvbn-ts with its common-passwords/words dictionary, on the server only (the
// dictionary is large). A score below 3 (fewer than ~10^8 guesses) is refused with the reason.
import { ZxcvbnFactory } from '@zxcvbn-ts/core'
import * as common from '@zxcvbn-ts/language-common'

export const MIN_PASSWORD_SCORE = 3

let factory: ZxcvbnFactory | undefined
function estimator() {
  factory ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs })
  return factory
}

// zxcvbn's warning keys in our words (the library ships them untranslated without a language pack).
const WARNINGS: Record<string, string> = {
  straightRow: 'a straight row of keys is easy to guess',
  keyPattern: 'a short keyboard pattern is easy to guess',
  simpleRepeat: 'repeated characters such as "aaa" are easy to guess',
  extendedRepeat: 'repeated patterns such as "abcabc" are easy to guess',
  sequences: 'sequences such as "abc" or "1234" are easy to guess',
  recentYears: 'recent years are easy to guess',
  dates: 'dates are easy to guess',
  topTen: 'this is one of the ten most used passwords',
  topHundred: 'this is one of the hundred most used passwords',
  common: 'this is a commonly used password',
  similarToCommon: 'this is close to a commonly used password',
  wordByItself: 'a single word is easy to guess',
  namesByThemselves: 'names by themselves are easy to guess',
  commonNames: 'common names are easy to guess',
  userInputs: 'it contains your name or e-mail address',
  pwned: 'this password appeared in a data breach',
}

/**
 * Why a password is too weak, or null when it is strong enough. `related` are the account's own
 * words (e-mail, name), which zxcvbn treats as guessable.
 */
export function passwordWeakness(password: string, related: string[] = []): string | null {
  if (!password.trim()) return 'is only spaces'
  const words = related.flatMap(s => [s, ...s.toLowerCase().split(/[^\p{L}\p{N}]+/u)]).filter(w => w.length >= 3)
  const result = estimator().check(password, words)
  if (result.score >= MIN_PASSWORD_SCORE) return null
  const warning = result.feedback.warning ? WARNINGS[result.feedback.warning] : undefined
  return `is too easy to guess${warning ? `: ${warning}` : ''}; use a longer phrase of several unrelated words`
}

/** 400 naming `password` when the password is too weak (registration, reset, any change). */
export function assertStrongPassword(password: string, related: string[] = []) {
  const weakness = passwordWeakness(password, related)
  if (weakness) throw fieldError(400, 'password', weakness, { reason: 'weak' })
}

// A hash of a random password, made once with the same algorithm and cost as real ones: unknown
// accounts are verified against it so sign-in takes as long whether or not the address exists.
let dummy: Promise<string> | undefined
export function dummyPasswordHash() {
  dummy ??= hashPassword(newSecret())
  return dummy
}
