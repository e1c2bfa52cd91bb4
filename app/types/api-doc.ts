// The parts of the OpenAPI document the API page shows.
export interface ApiSchema { type?: string | string[], enum?: unknown[], description?: string, properties?: Record<string, ApiSchema>, required?: string[], format?: string, default?: unknown, $ref?: string, contentMediaType?: string }

export interface ApiOperationDoc {
  tags: string[]
  summary: string
  description: string
  parameters?: { name: string, in: string, required?: boolean, description: string, schema: ApiSchema }[]
  requestBody?: { content: Record<string, { schema: ApiSchema }> }
  responses: Record<string, { $ref?: string, description?: string }>
  'x-plumbline-access': { roles: string[] | 'public', tokenScopes?: string[] }
  'x-plumbline-planned'?: boolean
}

export interface ApiDoc {
  info: { title: string, description: string }
  tags: { name: string, description: string }[]
  paths: Record<string, Record<string, ApiOperationDoc>>
  components: { responses: Record<string, { description: string }> }
}
