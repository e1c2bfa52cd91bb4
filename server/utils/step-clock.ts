// Timing of the steps of a long request, printed when PLUMBLINE_TIMING=1 (for profiling, never in tests).
export function stepClock() {
  const on = process.env.PLUMBLINE_TIMING === '1'
  let last = performance.now()
  return (step: string) => {
    if (!on) return
    const now = performance.now()
    console.log(`[timing] ${step}: ${(now - last).toFixed(0)} ms`)
    last = now
  }
}
