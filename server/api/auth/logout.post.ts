// Ends the session on the server (its row is revoked), not only in this browser.
export default defineEventHandler(async (event) => {
  await endSession(event)
  setResponseStatus(event, 204)
  return null
})
