/**
 * A tiny, safe arithmetic grammar for region boundaries, parsed by hand
 * (never eval'd):
 *
 *   expr    := term (('+' | '-') term)*
 *   term    := unary (('*' | '/') unary)*
 *   unary   := '-' unary | primary
 *   primary := number | name | ('sqrt' | 'abs') '(' expr ')' | '(' expr ')'
 *
 * Numbers are exact decimal literals (0.5, 1e3); names are parameters of
 * the set's function (n, x, nu, ...). `sqrt` and `abs` are reserved.
 */

export type Expr =
  | { t: 'num'; text: string }
  | { t: 'var'; name: string }
  | { t: 'neg'; a: Expr }
  | { t: 'bin'; op: '+' | '-' | '*' | '/'; a: Expr; b: Expr }
  | { t: 'fn'; fn: 'sqrt' | 'abs'; a: Expr }

export class ExpressionError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'ExpressionError'
  }
}

const TOKEN_RE = /\s*(?:(\d+\.?\d*(?:[eE][+-]?\d+)?|\.\d+(?:[eE][+-]?\d+)?)|([A-Za-z_][A-Za-z0-9_]*)|([-+*/()]))/y
const MAX_NODES = 64

/** Parse `text` into an AST; throws ExpressionError naming the column of the problem. */
export function parseExpression(text: string): Expr {
  const tokens: Array<{ kind: 'num' | 'name' | 'op'; text: string; col: number }> = []
  TOKEN_RE.lastIndex = 0
  let pos = 0
  while (pos < text.length) {
    if (/^\s*$/.test(text.slice(pos))) break
    TOKEN_RE.lastIndex = pos
    const m = TOKEN_RE.exec(text)
    if (!m) throw new ExpressionError(`Unexpected character '${text.slice(pos).trim()[0]}' at column ${pos + 1} of '${text}'.`)
    const col = m.index + m[0].length - (m[1] ?? m[2] ?? m[3] ?? '').length + 1
    if (m[1] !== undefined) tokens.push({ kind: 'num', text: m[1], col })
    else if (m[2] !== undefined) tokens.push({ kind: 'name', text: m[2], col })
    else tokens.push({ kind: 'op', text: m[3]!, col })
    pos = TOKEN_RE.lastIndex
  }
  let i = 0
  let nodes = 0
  const peek = () => tokens[i]
  const fail = (what: string): never => {
    const t = peek()
    throw new ExpressionError(t ? `${what} at column ${t.col} of '${text}'.` : `${what} at the end of '${text}'.`)
  }
  const node = <T extends Expr>(e: T): T => {
    if (++nodes > MAX_NODES) throw new ExpressionError(`Expression '${text}' is too long (at most ${MAX_NODES} parts).`)
    return e
  }
  const expect = (op: string) => {
    const t = peek()
    if (!t || t.kind !== 'op' || t.text !== op) fail(`Expected '${op}'`)
    i++
  }
  function primary(): Expr {
    const t = peek()
    if (!t) return fail('Expected a number, a parameter or (')
    if (t.kind === 'num') { i++; return node({ t: 'num', text: t.text }) }
    if (t.kind === 'name') {
      i++
      if (t.text === 'sqrt' || t.text === 'abs') {
        expect('(')
        const a = expr()
        expect(')')
        return node({ t: 'fn', fn: t.text, a })
      }
      return node({ t: 'var', name: t.text })
    }
    if (t.text === '(') {
      i++
      const a = expr()
      expect(')')
      return a
    }
    return fail(`Unexpected '${t.text}'`)
  }
  function unary(): Expr {
    const t = peek()
    if (t && t.kind === 'op' && t.text === '-') { i++; return node({ t: 'neg', a: unary() }) }
    return primary()
  }
  function term(): Expr {
    let a = unary()
    for (let t = peek(); t && t.kind === 'op' && (t.text === '*' || t.text === '/'); t = peek()) {
      i++
      a = node({ t: 'bin', op: t.text, a, b: unary() })
    }
    return a
  }
  function expr(): Expr {
    let a = term()
    for (let t = peek(); t && t.kind === 'op' && (t.text === '+' || t.text === '-'); t = peek()) {
      i++
      a = node({ t: 'bin', op: t.text, a, b: term() })
    }
    return a
  }
  if (tokens.length === 0) throw new ExpressionError('Enter a value or expression.')
  const e = expr()
  if (i < tokens.length) fail(`Unexpected '${peek()!.text}'`)
  return e
}

/** The parameter names an expression uses, in first-use order. */
export function expressionNames(e: Expr, out: string[] = []): string[] {
  switch (e.t) {
    case 'num': break
    case 'var': if (!out.includes(e.name)) out.push(e.name); break
    case 'neg': case 'fn': expressionNames(e.a, out); break
    case 'bin': expressionNames(e.a, out); expressionNames(e.b, out); break
  }
  return out
}
