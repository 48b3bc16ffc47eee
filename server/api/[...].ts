// Unknown API routes answer JSON 404, not the HTML page renderer.
export default defineEventHandler((event) => {
  throw httpError(404, `No API route ${event.method} ${event.path.split('?')[0]}`)
})
