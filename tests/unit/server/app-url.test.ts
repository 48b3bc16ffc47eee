// E-mailed links come from APP_URL only (server/utils/mail.ts); the built server is production.
import { afterEach, describe, expect, it } from 'vitest'
import { appUrl, appUrlProblem } from '../../../server/utils/mail'

const saved = process.env.APP_URL
afterEach(() => {
  if (saved === undefined) delete process.env.APP_URL
  else process.env.APP_URL = saved
})

describe('appUrl', () => {
  it('is APP_URL without a trailing slash', () => {
    process.env.APP_URL = 'https://polewright.example.org/'
    expect(appUrl()).toBe('https://polewright.example.org')
    expect(appUrlProblem()).toBeNull()
  })

  it('is null in production without APP_URL, and start-up says why', () => {
    delete process.env.APP_URL
    expect(appUrl()).toBeNull()
    expect(appUrlProblem()).toMatch(/^APP_URL is not set, so no e-mail with a link is sent/)
  })

  it.each(['polewright.example.org', 'ftp://polewright.example.org'])('names a malformed APP_URL %j', (value) => {
    process.env.APP_URL = value
    expect(appUrlProblem()).toMatch(/^APP_URL=/)
  })
})
