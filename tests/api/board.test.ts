import { beforeAll, describe, expect, it } from 'vitest'
import { DEMO_CODES } from '../../server/database/seed/scenario'
import { type Client, signedIn } from '../support/api'

let viewer: Client
beforeAll(async () => {
  viewer = await signedIn('viewer')
})

describe('board and codes', () => {
  it('lists every demo code with its versions in release order, none verified yet', async () => {
    const res = await viewer.get('/api/board')
    expect(res.status).toBe(200)
    const modeforge = res.body.codes.find((c: { slug: string }) => c.slug === 'modeforge')
    expect(modeforge.versions.map((v: { label: string }) => v.label).slice(0, 3)).toEqual(['0.9.0', '0.9.1', '1.0.0-rc.1'])
    expect(res.body.codes).toHaveLength(DEMO_CODES.length)
  })

  it('filters by code and by owner', async () => {
    const one = await viewer.get('/api/board?code=quadrat')
    expect(one.body.codes.map((c: { slug: string }) => c.slug)).toEqual(['quadrat'])
    const owner = await signedIn('owner')
    const me = await owner.get('/api/auth/me')
    const mine = await viewer.get(`/api/board?owner=${me.body.user.id}`)
    expect(mine.body.codes.map((c: { slug: string }) => c.slug).sort()).toEqual(['oscillite', 'quadrat'])
  })

  it('rejects a malformed filter with the field named', async () => {
    const res = await viewer.get('/api/board?owner=abc')
    expect(res.status).toBe(400)
    expect(res.body.data.issues[0].field).toBe('owner')
  })

  it('shows one code with owners and its versions', async () => {
    const res = await viewer.get('/api/codes/oscillite')
    expect(res.status).toBe(200)
    expect(res.body.owners.map((o: { email: string }) => o.email)).toEqual(['owner@corrie-point.test'])
    // other tests add versions to this code; the seeded ones keep their order among them
    const seeded = ['2.3.0', '2.4.0', '2.4.1']
    expect(res.body.versions.map((v: { label: string }) => v.label).filter((l: string) => seeded.includes(l))).toEqual(seeded)
    expect((await viewer.get('/api/codes/no-such-code')).status).toBe(404)
    expect((await viewer.get('/api/codes/Bad%20Slug')).status).toBe(400)
  })
})
