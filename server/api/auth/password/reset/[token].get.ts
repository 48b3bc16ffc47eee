// Public: lets the reset page say at once whether its link still works (before a new password is typed).
export default defineEventHandler(async (event) => {
  const row = await findPasswordReset(getRouterParam(event, 'token') ?? '')
  if (!row) throw fieldError(404, 'token', 'this reset link is not valid (check that the whole link was copied)')
  const status = passwordResetStatus(row)
  return { status, valid: status === 'pending', expiresAt: row.expiresAt }
})
