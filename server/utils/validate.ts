import type { H3Event } from 'h3'
import type { z } from 'zod'

/** Field-level issues in a form a page can show next to each field. */
export interface FieldIssue {
  field: string
  message: string
}

/** Parse with a zod schema or throw a 400 that names every failing field. */
export function parseOr400<S extends z.ZodType>(schema: S, input: unknown, what = 'request'): z.infer<S> {
  const result = schema.safeParse(input)
  if (result.success) return result.data
  const issues: FieldIssue[] = result.error.issues.map(i => ({
    field: i.path.length ? i.path.join('.') : '(body)',
    message: i.message,
  }))
  throw httpError(400, 'invalid_input', `Invalid ${what}: ${issues.map(i => `${i.field}: ${i.message}`).join('; ')}`, { issues })
}

// h3's readValidatedBody wraps any thrown error in its own "Validation Error",
// which would bury the field list one level deeper; these read, then parse.
export async function readJsonBody(event: H3Event): Promise<unknown> {
  try {
    return (await readBody(event)) ?? {}
  }
  catch {
    throw httpError(400, 'invalid_json', 'The body is not valid JSON.')
  }
}

export async function validBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  return parseOr400(schema, await readJsonBody(event), 'body')
}

export function validParams<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getRouterParams(event, { decode: true }), 'path')
}

export function validQuery<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return parseOr400(schema, getQuery(event), 'query')
}
