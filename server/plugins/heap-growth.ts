import { setFlagsFromString } from 'node:v8'

// A large submission leaves a few hundred MB of old-generation garbage (its
// parsed table and cases), which V8 by default frees only once the heap has
// grown well past its live size: two 100,000-row submissions back to back then
// peaked at about 640 MB of RSS. Growing the heap by at most 2× between full
// collections keeps that near 400 MB, with times within run-to-run noise
// (bench/submission.ts). V8 reads this flag at each collection, so setting it
// here covers the server however it is started.
export default defineNitroPlugin(() => {
  setFlagsFromString('--heap-growing-percent=100')
})
