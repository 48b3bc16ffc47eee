// Start-up checks of the security settings: e-mailed links come from APP_URL only (say so when it
// is missing or malformed), and the dummy password hash is made before the first sign-in needs it.
// Unusable session rows are pruned at start and once a day.
export default defineNitroPlugin(() => {
  const problem = appUrlProblem()
  if (problem) console.error(`[mail] ${problem}`)
  void dummyPasswordHash()
  const prune = () => dbReady().then(() => pruneSessions()).catch(e => console.error('[sessions] prune failed:', (e as Error).message))
  void prune()
  setInterval(prune, 24 * 3600 * 1000).unref()
})
