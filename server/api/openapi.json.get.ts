import { openApiDocument } from '../openapi/document'

// Public: the OpenAPI 3.1 description of the public API (also shown on the API page).
export default defineEventHandler(() => openApiDocument())
