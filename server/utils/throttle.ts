// Per-e-mail throttles for sign-in and password reset (rate-limiter-flexible, in memory).
import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible'

const failedLogins = new RateLimiterMemory({
  keyPrefix: 'login',
  points: Number(process.env.POLEWRIGHT_LOGIN_ATTEMPTS || 5),
  duration: 15 * 60,
})

const resetRequests = new RateLimiterMemory({ keyPrefix: 'reset', points: 3, duration: 60 * 60 })

function minutes(res: RateLimiterRes) {
  return Math.max(1, Math.ceil(res.msBeforeNext / 60000))
}

export async function assertLoginAllowed(email: string) {
  const res = await failedLogins.get(email)
  if (res && res.remainingPoints <= 0) {
    throw fieldError(429, 'email', `too many failed sign-in attempts; try again in ${minutes(res)} minute(s)`)
  }
}

export async function recordFailedLogin(email: string) {
  await failedLogins.penalty(email, 1)
}

export async function clearFailedLogins(email: string) {
  await failedLogins.delete(email)
}

/** Throws 429 after a few reset requests for one address (whether or not it exists). */
export async function consumeResetRequest(email: string) {
  try {
    await resetRequests.consume(email)
  }
  catch (res) {
    if (res instanceof RateLimiterRes) throw fieldError(429, 'email', `too many reset requests; try again in ${minutes(res)} minute(s)`)
    throw res
  }
}
