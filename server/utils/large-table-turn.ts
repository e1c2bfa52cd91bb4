// Large tables are judged one at a time in each server process. Judging runs
// on Node's one thread anyway, so taking turns costs no throughput, but two
// large submissions side by side would each hold their parsed table and cases
// (about 130 MB per 100,000 rows) at once. Small tables never wait.

/** Tables from this size up take turns (about 60,000 rows of a typical three-column table). */
export const LARGE_TABLE_BYTES = 2 * 1024 * 1024

/** A queue of turns: each `run` starts once every earlier one has settled. */
export class TurnQueue {
  private tail: Promise<void> = Promise.resolve()

  async run<T>(work: () => Promise<T>): Promise<T> {
    const before = this.tail
    let done!: () => void
    this.tail = new Promise<void>((resolve) => { done = resolve })
    try {
      await before
      return await work()
    }
    finally {
      done()
    }
  }
}

const largeTables = new TurnQueue()

/** Run `work` for a table of `bytes`: in turn when the table is large, at once otherwise. */
export function inLargeTableTurn<T>(bytes: number, work: () => Promise<T>): Promise<T> {
  return bytes >= LARGE_TABLE_BYTES ? largeTables.run(work) : work()
}
