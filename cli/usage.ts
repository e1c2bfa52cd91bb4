/** Errors that mean "bad input or usage": the client exits 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'UsageError'
  }
}

/** Parse --name value / --name=value / --flag options; the rest are positionals. */
export function parseOptions(args: string[], valued: string[], flags: string[]): { opts: Record<string, string>; positional: string[] } {
  const opts: Record<string, string> = {}
  const positional: string[] = []
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!
    if (!a.startsWith('--')) { positional.push(a); continue }
    const eq = a.indexOf('=')
    const name = a.slice(2, eq < 0 ? undefined : eq)
    if (flags.includes(name)) { opts[name] = 'true'; continue }
    if (!valued.includes(name)) throw new UsageError(`unknown option '--${name}'`)
    const v = eq >= 0 ? a.slice(eq + 1) : args[++i]
    if (v === undefined) throw new UsageError(`option '--${name}' needs a value`)
    opts[name] = v
  }
  return { opts, positional }
}
