/**
 * plumbline — the command-line client. A small dispatcher over subcommands:
 *   eval    certified reference values for a CSV of cases (cli/eval.ts)
 * Exit codes: 0 done, 1 internal failure, 2 bad input or usage.
 */
import { runEval } from './eval'
import { UsageError } from './usage'

const SUBCOMMANDS: Record<string, { run: (args: string[]) => Promise<number>; summary: string }> = {
  eval: { run: runEval, summary: 'compute certified reference values (see: plumbline eval --help)' },
}

function help(): string {
  return ['usage: plumbline <command> [options]', '', 'commands:',
    ...Object.entries(SUBCOMMANDS).map(([name, c]) => `  ${name.padEnd(8)}${c.summary}`)].join('\n')
}

async function main(argv: string[]): Promise<number> {
  const [cmd, ...rest] = argv
  if (!cmd || cmd === '--help' || cmd === '-h') {
    process.stdout.write(help() + '\n')
    return cmd ? 0 : 2
  }
  const sub = SUBCOMMANDS[cmd]
  if (!sub) throw new UsageError(`unknown command '${cmd}'\n${help()}`)
  return sub.run(rest)
}

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code },
  (err: unknown) => {
    if (err instanceof UsageError) {
      process.stderr.write(`plumbline: ${err.message}\n`)
      process.exitCode = 2
    } else {
      process.stderr.write(`plumbline: internal error: ${err instanceof Error ? err.stack ?? err.message : String(err)}\n`)
      process.exitCode = 1
    }
  },
)
