// API errors are JSON: { statusCode, statusMessage, message, data: { code, ... } }.
// `code` is stable for scripts; `message` says what to do next.
const REASONS: Record<number, string> = {
  400: 'Bad Request', 401: 'Unauthorized', 403: 'Forbidden', 404: 'Not Found',
  405: 'Method Not Allowed', 409: 'Conflict', 410: 'Gone', 413: 'Payload Too Large', 429: 'Too Many Requests', 500: 'Internal Server Error',
}

export function httpError(statusCode: number, code: string, message: string, extra: Record<string, unknown> = {}) {
  return createError({ statusCode, statusMessage: REASONS[statusCode] ?? 'Error', message, data: { code, ...extra } })
}
