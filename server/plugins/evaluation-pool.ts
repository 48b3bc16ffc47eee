// Starts the evaluation workers with the server (each warms its JIT as it loads), so the first
// evaluation request does not wait for thread start-up and compilation.
export default defineNitroPlugin(() => {
  if (import.meta.prerender) return
  poolInfo()
})
