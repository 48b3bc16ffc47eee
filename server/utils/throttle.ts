// Throttles (rate-limiter-flexible, in memory: one server process; they reset on restart).
//
// Sign-in: a point is consumed from every limiter *before* the password is verified, so a parallel
// burst cannot get more guesses checked than the limit; a success gives the points back. Keys
// (the usual OWASP pattern): account + client address (tight), account alone (a looser ceiling, so
// one address cannot lock the owner out, yet many addresses cannot guess for ever), and the client
// address across accounts (password spraying).
import type { H3Event } from 'h3'
import { isIP } from 'node:net'
import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible'

const env = (name: string, fallback: number) => {
  const n = Number(process.env[name])
  return Number.isInteger(n) && n > 0 ? n : fallback
}

export const LOGIN_LIMITS = {
  accountAddress: { points: env('POLEWRIGHT_LOGIN_ATTEMPTS', 5), minutes: 15 },
  account: { points: env('POLEWRIGHT_LOGIN_ACCOUNT_ATTEMPTS', 50), minutes: 60 },
  address: { points: env('POLEWRIGHT_LOGIN_ADDRESS_ATTEMPTS', 100), minutes: 60 },
}

const limiter = (keyPrefix: string, l: { points: number, minutes: number }) =>
  new RateLimiterMemory({ keyPrefix, points: l.points, duration: l.minutes * 60 })

const byAccountAddress = limiter('login-account-address', LOGIN_LIMITS.accountAddress)
const byAccount = limiter('login-account', LOGIN_LIMITS.account)
const byAddress = limiter('login-address', LOGIN_LIMITS.address)

const resetRequests = new RateLimiterMemory({ keyPrefix: 'reset', points: 3, duration: 60 * 60 })

function minutes(res: RateLimiterRes) {
  return Math.max(1, Math.ceil(res.msBeforeNext / 60000))
}

/**
 * The caller's address for throttling. Behind reverse proxies set POLEWRIGHT_TRUSTED_PROXIES to
 * their number: each appends the address it saw to X-Forwarded-For, so the client is that many
 * entries from the right. Off (0) by default: the header is ignored and the socket's peer counts,
 * because anyone can send X-Forwarded-For.
 */
export function clientAddress(event: H3Event): string {
  const peer = normalise(event.node.req.socket?.remoteAddress ?? '') || 'unknown'
  const hops = env('POLEWRIGHT_TRUSTED_PROXIES', 0)
  if (!hops) return peer
  const forwarded = (getRequestHeader(event, 'x-forwarded-for') ?? '').split(',').map(s => normalise(s.trim())).filter(Boolean)
  const chain = [...forwarded, peer]
  const picked = chain[Math.max(0, chain.length - 1 - hops)]!
  return isIP(picked) ? picked : peer
}

function normalise(address: string) {
  return address.startsWith('::ffff:') && isIP(address.slice(7)) === 4 ? address.slice(7) : address.slice(0, 64)
}

type Step = [RateLimiterMemory, string, string]

/** One point from each limiter in turn; on the first refusal the earlier points go back and 429 names `email`. */
async function consumeAll(steps: Step[]) {
  const taken: [RateLimiterMemory, string][] = []
  for (const [l, key, message] of steps) {
    try {
      await l.consume(key)
      taken.push([l, key])
    }
    catch (res) {
      for (const [done, k] of taken) await done.reward(k, 1)
      if (res instanceof RateLimiterRes) throw fieldError(429, 'email', `${message}; try again in ${minutes(res)} minute(s)`, { retryAfterSeconds: Math.ceil(res.msBeforeNext / 1000) })
      throw res
    }
  }
}

export interface LoginTicket { email: string, address: string }

/**
 * Takes one attempt from every sign-in limiter, atomically, before any password is checked.
 * Throws 429 naming `email` when any limit is spent (the earlier limiters get their point back,
 * since nothing was checked).
 */
export async function consumeLoginAttempt(email: string, address: string): Promise<LoginTicket> {
  const steps: Step[] = [
    [byAccountAddress, `${email} ${address}`, 'too many failed sign-in attempts for this account from your address'],
    [byAccount, email, 'too many failed sign-in attempts for this account'],
    [byAddress, address, 'too many failed sign-in attempts from your address'],
  ]
  await consumeAll(steps)
  return { email, address }
}

/** A correct password: the attempt is given back and the consecutive failures from this address forgotten. */
export async function loginSucceeded(ticket: LoginTicket) {
  await byAccountAddress.delete(`${ticket.email} ${ticket.address}`)
  await byAccount.reward(ticket.email, 1)
  await byAddress.reward(ticket.address, 1)
}

/** After a password reset the account starts with a clean slate. */
export async function clearFailedLogins(email: string) {
  await byAccount.delete(email)
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

// Invitation mail (each one carries a link to a project): per project and per inviter, so a new
// project cannot be used to mail strangers in bulk.
export const INVITATION_LIMITS = {
  project: { points: env('POLEWRIGHT_INVITES_PER_PROJECT', 10), minutes: 60 },
  inviter: { points: env('POLEWRIGHT_INVITES_PER_INVITER', 20), minutes: 24 * 60 },
}
const invitesByProject = limiter('invite-project', INVITATION_LIMITS.project)
const invitesByInviter = limiter('invite-inviter', INVITATION_LIMITS.inviter)

/** Takes one invitation from the project's and the inviter's allowance; 429 naming `email` when spent. */
export async function consumeInvitation(projectId: number, inviterId: number) {
  const steps: Step[] = [
    [invitesByProject, String(projectId), `this project has sent its ${INVITATION_LIMITS.project.points} invitations for the hour`],
    [invitesByInviter, String(inviterId), `you have sent your ${INVITATION_LIMITS.inviter.points} invitations for the day`],
  ]
  await consumeAll(steps)
}
