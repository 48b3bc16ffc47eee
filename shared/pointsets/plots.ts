// Data for the batch plots: a histogram of log10(relative deviation) and the scatter of deviation
// against the point's smallest invariant. Pure, so the binning is unit-tested.

export interface HistogramBin { from: number, to: number, count: number }

/**
 * Bins log10(d) of the positive deviations into bins of `width` decades, aligned to multiples of
 * the width; deviations exactly 0 (value equal to the target in every digit) are counted apart.
 */
export function deviationHistogram(deviations: (number | null)[], width = 0.5) {
  let zeros = 0
  const logs: number[] = []
  for (const d of deviations) {
    if (d === null || !Number.isFinite(d)) continue
    if (d <= 0) zeros++
    else logs.push(Math.log10(d))
  }
  if (!logs.length) return { bins: [] as HistogramBin[], zeros, lo: null, hi: null }
  // A loop, not Math.min(...logs): spreading 10,000+ values can overflow the argument stack.
  let min = Infinity, max = -Infinity
  for (const x of logs) {
    if (x < min) min = x
    if (x > max) max = x
  }
  const lo = Math.floor(min / width) * width
  const hi = Math.max(lo + width, Math.ceil(max / width) * width)
  const count = Math.max(1, Math.round((hi - lo) / width))
  const bins: HistogramBin[] = Array.from({ length: count }, (_, k) => ({ from: lo + k * width, to: lo + (k + 1) * width, count: 0 }))
  for (const x of logs) bins[Math.min(count - 1, Math.floor((x - lo) / width))]!.count++
  return { bins, zeros, lo, hi }
}

/** Points of the scatter: x = log10(min |s_ij| / s), y = log10(deviation); zeros and nulls left out. */
export function deviationScatter(cols: { idx: number[], deviation: (number | null)[], minInvariant: (number | null)[], verdict: string[] }) {
  const out: { x: number, y: number, idx: number, verdict: string }[] = []
  cols.idx.forEach((idx, k) => {
    const d = cols.deviation[k]
    const m = cols.minInvariant[k]
    if (d === null || d === undefined || m === null || m === undefined || !(d > 0) || !(m > 0)) return
    out.push({ x: Math.log10(m), y: Math.log10(d), idx, verdict: cols.verdict[k]! })
  })
  return out
}
