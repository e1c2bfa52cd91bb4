/**
 * plumbline — the command-line client. A small dispatcher over subcommands:
 *   eval    certified reference values for a CSV of cases (cli/eval.ts)
 *   submit  post an output table from CI and gate on its verdict (cli/submit.ts)
 * Exit codes: eval: 0 done, 1 internal failure, 2 bad input or usage.
 * submit: 0 all pass, 1 some case fails, 2 bad input or usage, 3 server or network error.
 */
import { runEval } from './eval'
import { ServerError, runSubmit } from './submit'
import { UsageError } from './usage'

const SUBCOMMANDS: Record<string, { run: (args: string[]) => Promise<number>; summary: string; internalExit: number }> = {
  eval: { run: runEval, summary: 'compute certified reference values (see: plumbline eval --help)', internalExit: 1 },
  submit: { run: runSubmit, summary: 'submit an output table from CI; exits 1 when a case fails (see: plumbline submit --help)', internalExit: 3 },
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

const argv = process.argv.slice(2)
main(argv).then(
  (code) => { process.exitCode = code },
  (err: unknown) => {
    if (err instanceof UsageError) {
      process.stderr.write(`plumbline: ${err.message}\n`)
      process.exitCode = 2
    } else if (err instanceof ServerError) {
      process.stderr.write(`plumbline: ${err.message}\n`)
      process.exitCode = 3
    } else {
      process.stderr.write(`plumbline: internal error: ${err instanceof Error ? err.stack ?? err.message : String(err)}\n`)
      process.exitCode = SUBCOMMANDS[argv[0] ?? '']?.internalExit ?? 1
    }
  },
)
