/** "2026-12-01 18:53 UTC": the same text on the server and in the browser, so hydration matches. */
export function formatUtc(value: string | number | Date | null | undefined): string {
  if (value === null || value === undefined) return ''
  const d = new Date(value)
  return Number.isNaN(d.getTime()) ? '' : `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`
}
