// Large tables take turns (server/utils/large-table-turn.ts); small ones never wait.
import { describe, expect, it } from 'vitest'
import { inLargeTableTurn, LARGE_TABLE_BYTES, TurnQueue } from '../../../server/utils/large-table-turn'

/** A piece of work that finishes when told to, logging its start and end. */
function gated(log: string[], name: string) {
  let finish!: () => void
  const finished = new Promise<void>((resolve) => { finish = resolve })
  return {
    finish: () => finish(),
    work: async () => {
      log.push(`${name} starts`)
      await finished
      log.push(`${name} ends`)
      return name
    },
  }
}
const tick = () => new Promise(resolve => setTimeout(resolve, 0))

describe('a queue of turns', () => {
  it('starts each piece of work once the one before has finished, in order', async () => {
    const q = new TurnQueue()
    const log: string[] = []
    const a = gated(log, 'a')
    const b = gated(log, 'b')
    const c = gated(log, 'c')
    const results = [q.run(a.work), q.run(b.work), q.run(c.work)]
    await tick()
    expect(log).toEqual(['a starts'])
    b.finish() // finishing early changes nothing: b has not started
    await tick()
    expect(log).toEqual(['a starts'])
    a.finish()
    await tick()
    expect(log).toEqual(['a starts', 'a ends', 'b starts', 'b ends', 'c starts'])
    c.finish()
    expect(await Promise.all(results)).toEqual(['a', 'b', 'c'])
  })

  it('passes the turn on when a piece of work fails', async () => {
    const q = new TurnQueue()
    const failing = q.run(async () => { throw new Error('unreadable rows') })
    const next = q.run(async () => 'next')
    await expect(failing).rejects.toThrow('unreadable rows')
    expect(await next).toBe('next')
  })
})

describe('large tables', () => {
  it('wait for the large table before them; small tables do not', async () => {
    const log: string[] = []
    const big1 = gated(log, 'big 1')
    const big2 = gated(log, 'big 2')
    const small = gated(log, 'small')
    const running = [inLargeTableTurn(LARGE_TABLE_BYTES, big1.work), inLargeTableTurn(LARGE_TABLE_BYTES + 1, big2.work), inLargeTableTurn(LARGE_TABLE_BYTES - 1, small.work)]
    await tick()
    expect([...log].sort()).toEqual(['big 1 starts', 'small starts'])
    small.finish()
    big1.finish()
    await tick()
    expect(log).toContain('big 2 starts')
    big2.finish()
    expect(await Promise.all(running)).toEqual(['big 1', 'big 2', 'small'])
  })
})
