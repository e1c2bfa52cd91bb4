// JSON Schemas (OpenAPI 3.1 dialect) of the replies the public API gives.
// Request bodies come from the zod schemas the routes validate with
// (document.ts), so those cannot drift from what the server checks.
const str = { type: 'string' } as const
const strOrNull = { type: ['string', 'null'] } as const
const int = { type: 'integer' } as const
const intOrNull = { type: ['integer', 'null'] } as const
const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` })

export const VERDICT_ENUM = ['pass', 'fail', 'missing', 'unexpected', 'non_finite', 'duplicate', 'accepted']
const counts = { type: 'object', description: 'Cases by verdict.', additionalProperties: int, propertyNames: { enum: VERDICT_ENUM } }

export const SCHEMAS: Record<string, unknown> = {
  Error: {
    type: 'object',
    description: 'Every error is JSON. `data.code` is stable for scripts; `message` says what to do next.',
    required: ['statusCode', 'message', 'data'],
    properties: {
      statusCode: int,
      statusMessage: str,
      message: { ...str, description: 'What went wrong and what to do, in words a person can act on.' },
      data: {
        type: 'object',
        required: ['code'],
        properties: {
          code: { ...str, description: 'Stable error code, e.g. unauthenticated, forbidden, bad_token, token_scope, token_wrong_code, invalid_input, unreadable_rows, not_found, not_ready, too_large, no_such_route, method_not_allowed.' },
          issues: { type: 'array', description: 'Invalid fields, each named.', items: { type: 'object', properties: { field: str, message: str } } },
          errors: { type: 'array', description: 'Unreadable rows of a table, with line and column.', items: { type: 'object', properties: { line: int, column: int, field: str, message: str } } },
        },
      },
    },
  },
  Figures: {
    type: 'object',
    properties: { total: int, counts, maxRelError: strOrNull, medianRelError: strOrNull, rmsRelError: strOrNull, maxUlps: strOrNull },
    description: 'Error figures as exact decimal strings.',
  },
  CaseRow: {
    type: 'object',
    properties: {
      id: int, line: intOrNull, inputs: { type: ['object', 'null'], additionalProperties: str }, region: strOrNull,
      measured: { ...strOrNull, description: 'The value as the table wrote it.' }, reference: strOrNull, referenceDigits: intOrNull, kappa: strOrNull,
      absError: strOrNull, relError: strOrNull, ulps: strOrNull, digitsAgreed: strOrNull,
      verdict: { enum: VERDICT_ENUM }, decidedBy: { ...str, description: 'Which part of the criterion decided the verdict.' },
    },
  },
  Run: {
    type: 'object',
    properties: {
      id: int,
      createdAt: { ...str, format: 'date-time' },
      code: { type: 'object', properties: { slug: str, name: str } },
      version: { type: 'object', properties: { id: int, label: str, commitId: str } },
      set: { type: 'object', properties: { id: int, slug: str, name: str, revision: int, functionId: str, targetDigits: int, parameters: { type: 'array', items: str }, criterion: {} } },
      fileName: str, fileSha256: str, fileSize: int, submittedBy: strOrNull,
      state: { enum: ['passed', 'failed', 'accepted', 'unverified', 'stale'] },
      summary: ref('Figures'),
      regions: { type: 'object', additionalProperties: ref('Figures') },
      worst: { oneOf: [ref('CaseRow'), { type: 'null' }] },
      isRegression: { type: 'boolean' },
    },
  },
  SubmitReply: {
    type: 'object',
    properties: { run: { type: 'object', properties: { id: int, counts } }, duplicate: { type: 'boolean', description: 'True when this exact file was already judged for this version and set; the earlier run is returned.' } },
  },
  CasePage: { type: 'object', properties: { total: int, page: int, pageSize: int, rows: { type: 'array', items: ref('CaseRow') } } },
  RunExport: {
    type: 'object',
    properties: { run: ref('Run'), caution: str, cases: { type: 'array', items: ref('CaseRow') } },
  },
  ErrorMap: {
    type: 'object',
    properties: {
      xParam: str, yParam: strOrNull, metric: { enum: ['ulps', 'relative'] },
      points: { type: 'array', items: { type: 'object', properties: { x: { type: 'number' }, y: { type: 'number' }, log10: { type: ['number', 'null'] }, verdict: { enum: VERDICT_ENUM }, caseId: int } } },
    },
  },
  Board: {
    type: 'object',
    properties: {
      sets: { type: 'array', items: { type: 'object', properties: { id: int, slug: str, name: str, revision: int } } },
      codes: {
        type: 'array',
        items: {
          type: 'object',
          properties: {
            id: int, slug: str, name: str, team: str,
            versions: {
              type: 'array',
              items: {
                type: 'object',
                properties: {
                  id: int, label: str, commitId: str,
                  cells: { type: 'array', items: { type: 'object', properties: { set: str, state: { enum: ['passed', 'failed', 'accepted', 'unverified', 'stale'] }, runId: intOrNull, failures: int } } },
                },
              },
            },
          },
        },
      },
    },
  },
  CodeList: {
    type: 'object',
    properties: { codes: { type: 'array', items: { type: 'object', properties: { id: int, slug: str, name: str, description: str, language: str, team: str, versionCount: int, owners: { type: 'array', items: str } } } } },
  },
  CodeDetail: {
    type: 'object',
    properties: {
      code: { type: 'object', properties: { id: int, slug: str, name: str, description: str, language: str, team: str } },
      owners: { type: 'array', items: { type: 'object', properties: { id: int, name: str, email: str } } },
      versions: { type: 'array', items: { type: 'object', properties: { id: int, label: str, commitId: str, environment: { type: 'object' }, createdAt: str } } },
    },
  },
  Token: {
    type: 'object',
    description: 'A CI token as lists show it: never the secret.',
    properties: {
      id: int, name: str, scope: { enum: ['submit', 'read'] }, prefix: { ...str, description: 'The first characters, to tell tokens apart.' }, demoOnly: { type: 'boolean' },
      state: { enum: ['active', 'revoked', 'expired'] }, expiresAt: strOrNull, revokedAt: strOrNull, lastUsedAt: strOrNull, createdBy: strOrNull, createdAt: str,
    },
  },
  ReferenceSetSummary: {
    type: 'object',
    properties: { id: int, slug: str, revision: int, name: str, functionId: str, convention: str, targetDigits: int, state: { enum: ['draft', 'computing', 'ready', 'failed'] }, caseCount: int, casesDone: int, frozenAt: strOrNull, source: str },
  },
}
