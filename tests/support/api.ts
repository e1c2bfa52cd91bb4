// A tiny HTTP client for API tests: keeps the session cookie of one signed-in
// user and sends the Origin header a browser would.
import { DEMO_USERS } from '../../server/database/seed/scenario'
import type { Role } from '../../shared/domain/enums'

export const BASE = process.env.PLUMBLINE_TEST_URL ?? 'http://127.0.0.1:3100'

export interface Reply<T = unknown> { status: number, body: T, headers: Headers }

export class Client {
  cookie = ''
  base = BASE
  constructor(public address = '127.0.0.1') {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
    const res = await fetch(BASE + path, {
      method,
      redirect: 'manual',
      headers: {
        'origin': BASE,
        'x-forwarded-for': this.address,
        ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
    const set = res.headers.getSetCookie()
    for (const c of set) {
      const [pair] = c.split(';')
      if (pair?.startsWith('plumbline-session=')) this.cookie = pair
    }
    const text = await res.text()
    let parsed: unknown = text
    try {
      parsed = JSON.parse(text)
    }
    catch { /* not JSON */ }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.request<T>('POST', path, body ?? {}) }
  patch<T = any>(path: string, body?: unknown) { return this.request<T>('PATCH', path, body ?? {}) }

  async login(email: string, password: string) {
    return this.post('/api/auth/login', { email, password })
  }
}

export function demoUser(role: Role) {
  const u = DEMO_USERS.find(d => d.role === role)
  if (!u) throw new Error(`no demo user with role ${role}`)
  return u
}

/** A client signed in as the demo user of `role`. */
export async function signedIn(role: Role): Promise<Client> {
  const c = new Client()
  const u = demoUser(role)
  const r = await c.login(u.email, u.password)
  if (r.status !== 200) throw new Error(`demo ${role} could not sign in: ${r.status} ${JSON.stringify(r.body)}`)
  return c
}

let seq = 0
export const unique = (stem: string) => `${stem}-${Date.now().toString(36)}-${(seq++).toString(36)}`
