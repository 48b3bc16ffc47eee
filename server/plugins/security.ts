// Start-up checks of the security settings: e-mailed links come from APP_URL only (say so when it
// is missing or malformed), and the dummy password hash is made before the first sign-in needs it.
export default defineNitroPlugin(() => {
  const problem = appUrlProblem()
  if (problem) console.error(`[mail] ${problem}`)
  void dummyPasswordHash()
})
