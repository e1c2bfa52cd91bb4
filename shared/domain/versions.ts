// Order of a code's versions: labels that read as semantic versions
// (1.2.10, v2.0.0-rc.1) sort by their numbers, and come before other labels,
// which keep their order of creation.

const SEMVER = /^v?(\d+)\.(\d+)(?:\.(\d+))?(?:-([0-9A-Za-z.-]+))?(?:\+[0-9A-Za-z.-]+)?$/

interface Parsed { nums: [number, number, number], pre: string[] | null }

function parse(label: string): Parsed | null {
  const m = SEMVER.exec(label.trim())
  if (!m) return null
  return { nums: [Number(m[1]), Number(m[2]), Number(m[3] ?? 0)], pre: m[4] ? m[4].split('.') : null }
}

function comparePre(a: string[] | null, b: string[] | null): number {
  if (!a && !b) return 0
  if (!a) return 1 // a release is after its pre-releases
  if (!b) return -1
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const x = a[i]
    const y = b[i]
    if (x === undefined) return -1
    if (y === undefined) return 1
    const nx = /^\d+$/.test(x)
    const ny = /^\d+$/.test(y)
    if (nx && ny && Number(x) !== Number(y)) return Number(x) - Number(y)
    if (nx !== ny) return nx ? -1 : 1
    if (x !== y) return x < y ? -1 : 1
  }
  return 0
}

export interface Orderable { label: string, createdAt: Date | string, id: number }

export function compareVersions(a: Orderable, b: Orderable): number {
  const pa = parse(a.label)
  const pb = parse(b.label)
  if (pa && pb) {
    for (let i = 0; i < 3; i++) {
      const d = pa.nums[i]! - pb.nums[i]!
      if (d !== 0) return d
    }
    const d = comparePre(pa.pre, pb.pre)
    if (d !== 0) return d
  }
  else if (pa || pb) {
    return pa ? -1 : 1
  }
  const ta = new Date(a.createdAt).getTime()
  const tb = new Date(b.createdAt).getTime()
  return ta !== tb ? ta - tb : a.id - b.id
}

export function sortVersions<T extends Orderable>(list: readonly T[]): T[] {
  return [...list].sort(compareVersions)
}
