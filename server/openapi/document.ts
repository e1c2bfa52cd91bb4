// The OpenAPI 3.1 description of Plumbline's public API: the routes CI uses
// (submit, runs and their cases and exports, board, codes, tokens, health) and
// the reference-set downloads. Request bodies are generated from the same zod
// schemas the routes validate with; replies are in schemas.ts. A test checks
// this document against the OpenAPI schema and against the route files.
import { z } from 'zod'
import { submissionSchema } from '../../shared/schemas/submission'
import { issueTokenSchema } from '../../shared/schemas/api-token'
import { SCHEMAS } from './schemas'

type Json = Record<string, unknown>

function jsonSchema(s: z.ZodType): Json {
  const out = z.toJSONSchema(s, { io: 'input', unrepresentable: 'any' }) as Json
  delete out.$schema
  return out
}

/** Who may call an operation: shown on the API page and checked by the tests against the route matrix. */
export interface Access { roles: string[] | 'public', tokenScopes?: string[] }

interface Op {
  tag: string
  summary: string
  description: string
  access: Access
  params?: Json[]
  body?: Json
  ok: { status: number, description: string, content: Json }
  errors: number[]
  planned?: boolean
}

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` })
const json = (schema: Json) => ({ 'application/json': { schema } })
const pathParam = (name: string, description: string, schema: Json = { type: 'integer', minimum: 1 }) => ({ name, in: 'path', required: true, description, schema })
const queryParam = (name: string, description: string, schema: Json) => ({ name, in: 'query', required: false, description, schema })

const ERROR_TEXT: Record<number, string> = {
  400: 'Invalid input: `data.issues` names each field (and `data.errors` each unreadable row with its line and column).',
  401: 'Not signed in, or the token is unknown, revoked or expired (`unauthenticated`, `bad_token`).',
  403: 'Signed in with a role this route does not serve, or a token of another code or scope (`forbidden`, `token_wrong_code`, `token_scope`).',
  404: 'No such object (`not_found`).',
  409: 'The reference set is not ready yet (`not_ready`), or the object exists already (`conflict`).',
  410: 'The link was used already or has expired (`link_used`, `link_expired`).',
  413: 'The table is larger than 50 MB (`too_large`).',
}

function operation(id: string, o: Op): Json {
  const responses: Json = { [o.ok.status]: { description: o.ok.description, content: o.ok.content } }
  for (const s of o.errors) responses[s] = { $ref: `#/components/responses/E${s}` }
  const security = o.access.roles === 'public' ? [] : [{ session: [] }, ...(o.access.tokenScopes?.length ? [{ ciToken: [] }] : [])]
  return {
    operationId: id,
    tags: [o.tag],
    summary: o.summary,
    description: o.description,
    security,
    ...(o.params?.length ? { parameters: o.params } : {}),
    ...(o.body ? { requestBody: o.body } : {}),
    responses,
    'x-plumbline-access': o.access,
    ...(o.planned ? { 'x-plumbline-planned': true } : {}),
  }
}

const READERS = ['admin', 'qa', 'owner', 'viewer']
const runId = pathParam('id', 'The run\'s id.')

const FIELD_TEXT: Record<string, string> = {
  code: 'The code\'s slug, e.g. oscillite.',
  version: 'The version label; a label the code does not have yet makes a new version.',
  setId: 'The reference set\'s id (the number in its page\'s address): that revision. Give this or `set`.',
  set: 'The reference set\'s slug: its newest revision, so a pipeline follows revisions of the set. Give this or `setId`.',
  commit: 'The commit the table was built from.',
}

function submissionBodies(): Json {
  const fields = jsonSchema(submissionSchema)
  const props = Object.fromEntries(Object.entries(fields.properties as Record<string, Json>).map(([k, v]) => [k, FIELD_TEXT[k] ? { ...v, description: FIELD_TEXT[k] } : v]))
  const multipart = {
    ...fields,
    properties: {
      ...props,
      mapping: { type: 'string', contentMediaType: 'application/json', description: 'JSON: which column holds each parameter and the value, e.g. {"n":"n","x":"x","value":"H"}. Suggested from the header when left out.' },
      environment: { type: 'string', contentMediaType: 'application/json', description: 'JSON: the build environment (compiler, flags, platform, floatFormat, libraries).' },
      file: { type: 'string', format: 'binary', description: 'The output table: CSV, TSV, whitespace-separated or JSON, up to 50 MB.' },
    },
    required: [...(fields.required as string[]), 'file'],
  }
  const body = { ...fields, properties: { ...props, content: { type: 'string', description: 'The table as text.' }, fileName: { type: 'string' } }, required: [...(fields.required as string[]), 'content'] }
  return { required: true, content: { 'multipart/form-data': { schema: multipart }, 'application/json': { schema: body } } }
}

export function operations(): Record<string, Record<string, Op>> {
  return {
    '/api/health': {
      get: { tag: 'Service', summary: 'Is the service up', description: 'Answers when the web server and its database are reachable. For load balancers.', access: { roles: 'public' }, ok: { status: 200, description: 'Up.', content: json({ type: 'object', properties: { ok: { type: 'boolean' } } }) }, errors: [] },
    },
    '/api/openapi.json': {
      get: { tag: 'Service', summary: 'This description', description: 'The OpenAPI 3.1 description of the public API.', access: { roles: 'public' }, ok: { status: 200, description: 'The document.', content: json({ type: 'object' }) }, errors: [] },
    },
    '/api/runs': {
      post: {
        tag: 'Runs',
        summary: 'Submit an output table',
        description: 'Judges every case of the reference set against the table and stores the run, its raw file and every case result in one transaction. A new version label makes a new version, with the `commit` and `environment` sent. For an existing version these may be repeated, left out, or add fields it does not record yet; a value that contradicts what it records is refused with 409 `build_differs`, naming each field, since a different build needs a label of its own. The same file for the same version and set is recognised and its earlier run returned (200, `duplicate: true`). A table with any unreadable row is refused whole.',
        access: { roles: ['qa', 'admin'], tokenScopes: ['submit'] },
        body: submissionBodies(),
        ok: { status: 201, description: 'Judged and stored (200 for a duplicate).', content: json(ref('SubmitReply')) },
        errors: [400, 401, 403, 404, 409, 413],
      },
    },
    '/api/runs/{id}': {
      get: { tag: 'Runs', summary: 'A run', description: 'The run with its code, version, set, summary figures, figures per region and worst case.', access: { roles: READERS, tokenScopes: ['read', 'submit'] }, params: [runId], ok: { status: 200, description: 'The run.', content: json({ type: 'object', properties: { run: ref('Run') } }) }, errors: [400, 401, 403, 404] },
    },
    '/api/runs/{id}/cases': {
      get: {
        tag: 'Runs', summary: 'A run\'s cases, a page at a time', description: 'Sorted and filtered in the database.', access: { roles: READERS, tokenScopes: ['read', 'submit'] },
        params: [
          runId,
          queryParam('page', 'Page number, from 1.', { type: 'integer', minimum: 1, default: 1 }),
          queryParam('pageSize', 'Rows per page.', { type: 'integer', minimum: 1, maximum: 500, default: 50 }),
          queryParam('sort', 'Sort key.', { enum: ['line', 'relError', 'absError', 'ulps', 'digitsAgreed', 'verdict'], default: 'line' }),
          queryParam('dir', 'Sort direction.', { enum: ['asc', 'desc'], default: 'asc' }),
          queryParam('verdict', 'Only these verdicts, comma-separated, e.g. fail,missing.', { type: 'string' }),
          queryParam('region', 'Only this region.', { type: 'string' }),
          queryParam('minRel', 'Relative error at least.', { type: 'number', minimum: 0 }),
          queryParam('maxRel', 'Relative error at most.', { type: 'number', minimum: 0 }),
          queryParam('caseId', 'One case result by its id.', { type: 'integer', minimum: 1 }),
        ],
        ok: { status: 200, description: 'One page.', content: json(ref('CasePage')) },
        errors: [400, 401, 403, 404],
      },
    },
    '/api/runs/{id}/export': {
      get: {
        tag: 'Runs', summary: 'Every case of a run, as CSV or JSON', description: 'Each case with the measured value as written, the reference, the error figures and the verdict; with the caution that a verdict is evidence, not a substitute for a QA programme.', access: { roles: READERS, tokenScopes: ['read', 'submit'] },
        params: [runId, queryParam('format', 'csv or json.', { enum: ['csv', 'json'], default: 'csv' })],
        ok: { status: 200, description: 'The export, as an attachment.', content: { ...json(ref('RunExport')), 'text/csv': { schema: { type: 'string' } } } },
        errors: [400, 401, 403, 404],
      },
    },
    '/api/runs/{id}/map': {
      get: { tag: 'Runs', summary: 'Points of a run\'s error map', description: 'log10 of the ULP distance (or relative error) over the set\'s first two parameters.', access: { roles: READERS, tokenScopes: ['read', 'submit'] }, params: [runId], ok: { status: 200, description: 'The points.', content: json(ref('ErrorMap')) }, errors: [400, 401, 403, 404] },
    },
    '/api/board': {
      get: {
        tag: 'Status', summary: 'The board: codes × versions × reference sets', description: 'One cell per version and set; the latest run decides it. A read token sees its own code only.', access: { roles: READERS, tokenScopes: ['read'] },
        params: [queryParam('code', 'Only this code (slug).', { type: 'string' }), queryParam('owner', 'Only codes of this owner (user id).', { type: 'integer' }), queryParam('set', 'Only this reference set (slug).', { type: 'string' })],
        ok: { status: 200, description: 'The board.', content: json(ref('Board')) },
        errors: [400, 401, 403],
      },
    },
    '/api/codes': {
      get: { tag: 'Status', summary: 'The codes', description: 'Every code with its team, owners and number of versions; a read token sees its own code only.', access: { roles: READERS, tokenScopes: ['read'] }, ok: { status: 200, description: 'The codes.', content: json(ref('CodeList')) }, errors: [401, 403] },
    },
    '/api/codes/{slug}': {
      get: { tag: 'Status', summary: 'A code and its versions', description: 'The code, its owners and its versions with their build environments.', access: { roles: READERS, tokenScopes: ['read'] }, params: [pathParam('slug', 'The code\'s slug, e.g. oscillite.', { type: 'string', pattern: '^[a-z0-9-]{1,64}$' })], ok: { status: 200, description: 'The code.', content: json(ref('CodeDetail')) }, errors: [400, 401, 403, 404] },
    },
    '/api/codes/{slug}/tokens': {
      get: { tag: 'Tokens', summary: 'A code\'s CI tokens', description: 'Live and dead tokens, with scope, expiry and last use. Never the secret.', access: { roles: ['qa', 'admin'] }, params: [pathParam('slug', 'The code\'s slug.', { type: 'string' })], ok: { status: 200, description: 'The tokens.', content: json({ type: 'object', properties: { tokens: { type: 'array', items: ref('Token') } } }) }, errors: [400, 401, 403, 404] },
      post: {
        tag: 'Tokens', summary: 'Issue a CI token', description: 'The secret is in this reply only; Plumbline keeps its SHA-256. Scope `submit` posts tables for this code and reads back its runs; `read` reads its board, versions and runs.', access: { roles: ['qa', 'admin'] },
        params: [pathParam('slug', 'The code\'s slug.', { type: 'string' })],
        body: { required: true, content: json(jsonSchema(issueTokenSchema)) },
        ok: { status: 201, description: 'Issued.', content: json({ type: 'object', properties: { token: ref('Token'), secret: { type: 'string', description: 'Shown once.' }, note: { type: 'string' } } }) },
        errors: [400, 401, 403, 404],
      },
    },
    '/api/tokens/{id}/revoke': {
      post: { tag: 'Tokens', summary: 'Revoke a CI token', description: 'At once; the token stays listed as revoked.', access: { roles: ['qa', 'admin'] }, params: [pathParam('id', 'The token\'s id.')], ok: { status: 200, description: 'Revoked.', content: json({ type: 'object', properties: { token: ref('Token') } }) }, errors: [400, 401, 403, 404] },
    },
    '/api/reference-sets': {
      get: { tag: 'Reference sets', summary: 'The catalogue of reference sets', description: 'The newest revision of each set.', access: { roles: READERS }, ok: { status: 200, description: 'The sets.', content: json({ type: 'object', properties: { sets: { type: 'array', items: ref('ReferenceSetSummary') } } }) }, errors: [401] },
    },
    '/api/reference-sets/{id}': {
      get: { tag: 'Reference sets', summary: 'A reference set', description: 'Its definition, state, revisions and number of runs.', access: { roles: READERS }, params: [pathParam('id', 'The set\'s id.')], ok: { status: 200, description: 'The set.', content: json({ type: 'object', properties: { set: ref('ReferenceSetSummary') } }) }, errors: [400, 401, 404] },
    },
    '/api/reference-sets/{id}/cases': {
      get: { tag: 'Reference sets', summary: 'A set\'s cases, a page at a time', description: 'Inputs, certified reference values and digits.', access: { roles: READERS }, params: [pathParam('id', 'The set\'s id.'), queryParam('page', 'Page number.', { type: 'integer', minimum: 1 }), queryParam('pageSize', 'Rows per page.', { type: 'integer', minimum: 1 })], ok: { status: 200, description: 'One page.', content: json({ type: 'object' }) }, errors: [400, 401, 404] },
    },
    '/api/reference-sets/{id}/values': {
      get: { tag: 'Reference sets', summary: 'Download a set\'s reference values', description: 'CSV or JSON, at any digit count up to the certified one, correctly rounded.', access: { roles: READERS }, params: [pathParam('id', 'The set\'s id.'), queryParam('format', 'csv or json.', { enum: ['csv', 'json'], default: 'csv' }), queryParam('digits', 'Significant digits.', { type: 'integer', minimum: 1 })], ok: { status: 200, description: 'The values, as an attachment.', content: { ...json({ type: 'object' }), 'text/csv': { schema: { type: 'string' } } } }, errors: [400, 401, 404, 409] },
    },
    '/api/codes/{slug}/versions/{label}/record': {
      get: { tag: 'Records', summary: 'A version\'s verification record', description: 'The record of one version: each reference set with its source, certified digits and criterion as fixed, results per region, failures, deviations and how each was settled, signatures, and the caution that it is evidence for, not a substitute for, the organisation\'s QA programme.', access: { roles: READERS, tokenScopes: ['read'] }, params: [pathParam('slug', 'The code\'s slug, e.g. oscillite.', { type: 'string', pattern: '^[a-z0-9-]{1,64}$' }), pathParam('label', 'The version label, e.g. 2.5.0 (URL-encoded).', { type: 'string', minLength: 1, maxLength: 100 })], ok: { status: 200, description: 'The record.', content: json({ type: 'object' }) }, errors: [400, 401, 403, 404] },
    },
    '/api/codes/{slug}/versions/{label}/record/export': {
      get: { tag: 'Records', summary: 'Export a verification record', description: 'JSON, CSV or JUnit XML with one test case per reference-set case, so CI systems can show it.', access: { roles: READERS, tokenScopes: ['read'] }, params: [pathParam('slug', 'The code\'s slug, e.g. oscillite.', { type: 'string', pattern: '^[a-z0-9-]{1,64}$' }), pathParam('label', 'The version label, e.g. 2.5.0 (URL-encoded).', { type: 'string', minLength: 1, maxLength: 100 }), queryParam('format', 'json, csv or junit.', { enum: ['json', 'csv', 'junit'] })], ok: { status: 200, description: 'The export, as an attachment.', content: { ...json({ type: 'object' }), 'text/csv': { schema: { type: 'string' } }, 'application/xml': { schema: { type: 'string' } } } }, errors: [400, 401, 403, 404] },
    },
    '/api/codes/{slug}/compare': {
      get: { tag: 'Status', summary: 'Compare two versions of a code over one reference set', description: 'Cases newly failing, cases fixed, and the error change per case (largest regression first), with a summary line for release notes.', access: { roles: READERS }, params: [pathParam('slug', 'The code\'s slug, e.g. oscillite.', { type: 'string', pattern: '^[a-z0-9-]{1,64}$' }), queryParam('from', 'The earlier version label.', { type: 'string' }), queryParam('to', 'The later version label.', { type: 'string' }), queryParam('set', 'The reference set slug.', { type: 'string' })], ok: { status: 200, description: 'The comparison.', content: json({ type: 'object' }) }, errors: [400, 401, 404] },
    },
  }
}

export function openApiDocument(): Json {
  const ops = operations()
  const paths = Object.fromEntries(Object.entries(ops).map(([path, methods]) => [path, Object.fromEntries(Object.entries(methods).map(([m, o]) => [m, operation(`${m}${path.replace(/[{}]/g, '').replace(/[^a-zA-Z0-9]+(.)?/g, (_, c: string | undefined) => (c ?? '').toUpperCase())}`, o)]))]))
  return {
    openapi: '3.1.0',
    info: {
      title: 'Plumbline API',
      version: '1',
      description: 'Submit output tables from CI and read verdicts. Send a per-code CI token as `Authorization: Bearer <token>`, or use a signed-in session. Every error is JSON with a stable `data.code`. A verdict is evidence for a verification record; it does not replace an organisation\'s QA programme, local codes or licensed review.',
    },
    servers: [{ url: '/', description: 'This Plumbline server' }],
    tags: [
      { name: 'Runs', description: 'Submitting tables and reading their verdicts.' },
      { name: 'Status', description: 'Board, codes and versions.' },
      { name: 'Records', description: 'Verification records of versions.' },
      { name: 'Tokens', description: 'Per-code CI tokens (verification engineers and administrators).' },
      { name: 'Reference sets', description: 'What is checked, and the certified reference values.' },
      { name: 'Service', description: 'Health and this description.' },
    ],
    paths,
    components: {
      schemas: SCHEMAS,
      responses: Object.fromEntries(Object.entries(ERROR_TEXT).map(([s, d]) => [`E${s}`, { description: d, content: json(ref('Error')) }])),
      securitySchemes: {
        ciToken: { type: 'http', scheme: 'bearer', description: 'A per-code CI token (plb_…), issued on the code\'s page. Works only for its own code and scope.' },
        session: { type: 'apiKey', in: 'cookie', name: 'plumbline-session', description: 'The session of a signed-in user (the pages use it).' },
      },
    },
  }
}
