import { eq } from 'drizzle-orm'
import { ForgotPasswordSchema } from '#shared/schemas/collab'

const HOUR = 3600 * 1000

// The same 202 whether or not the address has an account, and the work (lookup, token, e-mail)
// starts only after the answer has gone out, so neither the body nor the response time tells them
// apart. Throttled per address (throttle.ts), known or not.
export default defineEventHandler(async (event) => {
  const { email } = await readValid(event, ForgotPasswordSchema)
  await consumeResetRequest(email)
  afterResponse(event, () => issueReset(email))
  setResponseStatus(event, 202)
  return { message: `If an account uses ${email}, a reset link is on its way. It works once, for one hour.` }
})

async function issueReset(email: string) {
  const origin = appUrl()
  if (!origin) {
    console.error('[reset] no reset link sent: APP_URL is not configured')
    return
  }
  const db = useDB()
  const user = await db.select().from(tables.users).where(eq(tables.users.email, email)).get()
  if (!user || user.disabled) return
  const token = newSecret()
  await db.insert(tables.passwordResets).values({ userId: user.id, tokenHash: hashSecret(token), expiresAt: new Date(Date.now() + HOUR) })
  await sendMail(composeMail({
    to: user.email,
    subject: 'Reset your Polewright password',
    paragraphs: [
      `Hello ${user.name},`,
      `Someone (hopefully you) asked to reset the password of the Polewright account ${user.email}. Open the link to choose a new one. It works once and expires in one hour.`,
      'When the new password is set, every session of this account, on every device, is signed out, and every API token of the account is revoked (scripts need a new token from the account page).',
    ],
    action: { label: 'Choose a new password', url: `${origin}/password/reset/${token}` },
    why: `You get this message because a password reset was requested for ${user.email} on the Polewright sign-in page. If it was not you, ignore it: your password stays as it is.`,
  }))
}
