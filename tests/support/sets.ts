// Building reference sets and output tables for API and browser tests.
import { expect } from 'vitest'
import type { Client } from './api'

export function hermiteSet(slug: string, over: Record<string, unknown> = {}) {
  return {
    name: `Test set ${slug}`,
    slug,
    functionId: 'hermite',
    convention: 'physicists, H_n',
    grid: { parts: [{ kind: 'range', axes: [{ param: 'n', start: '0', stop: '12', step: '4' }, { param: 'x', start: '-1', stop: '1', step: '0.5' }] }] },
    targetDigits: 20,
    criterion: { format: 'binary64', tolerance: { kind: 'ulps', maxUlps: '4' }, zero: { below: '1e-300', atol: '1e-300' }, overflow: { signedInf: 'pass' } },
    source: 'Plumbline reference engine, certified digits',
    ...over,
  }
}

/** Create a set through the API and wait until the worker has computed it. */
export async function readySet(client: Client, def: Record<string, unknown>) {
  const created = await client.post('/api/reference-sets', def)
  expect(created.status, JSON.stringify(created.body)).toBe(201)
  return waitReady(client, created.body.set.id as number)
}

async function waitReady(client: Client, id: number) {
  for (let i = 0; i < 300; i++) {
    const s = await client.get(`/api/reference-sets/${id}`)
    if (s.body.set.state === 'ready') return s.body.set
    if (s.body.set.state === 'failed') throw new Error(`set ${id} failed: ${s.body.set.error}`)
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error(`set ${id} did not become ready`)
}

/** Revise a set through the API (a new revision of its slug) and wait until the worker has computed it. */
export async function reviseSet(client: Client, id: number, def: Record<string, unknown>) {
  const revised = await client.request('PUT', `/api/reference-sets/${id}`, def)
  expect(revised.status, JSON.stringify(revised.body)).toBe(200)
  return waitReady(client, revised.body.set.id as number)
}

/** H_n(x) by the plain three-term recurrence in binary64, as a solver would compute it. */
export function hermiteDouble(n: number, x: number): number {
  if (n === 0) return 1
  let a = 1
  let b = 2 * x
  for (let k = 1; k < n; k++) [a, b] = [b, 2 * x * b - 2 * k * a]
  return b
}

/** POST a multipart upload as a browser form would. */
export async function upload(client: Client, path: string, fields: Record<string, string>, file: { name: string, content: string | Uint8Array }) {
  const form = new FormData()
  for (const [k, v] of Object.entries(fields)) form.append(k, v)
  form.append('file', new Blob([file.content as BlobPart]), file.name)
  const res = await fetch(client.base + path, { method: 'POST', body: form, headers: { origin: client.base, cookie: client.cookie } })
  const text = await res.text()
  let body: any = text
  try {
    body = JSON.parse(text)
  }
  catch { /* not JSON */ }
  return { status: res.status, body }
}
