// Issues of the reference-set form, keyed by dotted path
// ('grid.parts.0.axes.1.step'), from the shared zod schema in the browser
// or from a 400's data.issues; both land on the same fields.
import type { z } from 'zod'

export type IssueMap = Record<string, string>

// Every path the form shows beside a field; anything else is listed under the form.
const PLACED: RegExp[] = [
  /^(name|slug|functionId|output|convention|targetDigits|source|notes)$/,
  /^grid(\.parts)?$/,
  /^grid\.parts\.\d+(\.axes|\.kind)?$/,
  /^grid\.parts\.\d+\.axes\.\d+(\.(param|start|stop|step|min|max|places))?$/,
  /^grid\.parts\.\d+\.axes\.\d+\.values(\.\d+)?$/,
  /^grid\.parts\.\d+\.(points|fixed)(\..+)?$/,
  /^grid\.parts\.\d+\.(seed|count)$/,
  /^criterion(\.format|\.regions)?$/,
  /^criterion(\.regions\.\d+)?\.tolerance(\.\w+)?$/,
  /^criterion\.(zero\.below|zero\.atol|overflow\.signedInf|overflow|nan\.verdict|nan|zero)$/,
  /^criterion\.regions\.\d+(\.name|\.when)?$/,
  /^criterion\.regions\.\d+\.when\.\d+(\.(param|op|value))?$/,
]

/** Plainer words for zod's stock number and list messages; the schema's own messages are kept. */
function wording(i: z.core.$ZodIssue): string {
  if (i.code === 'too_small' && i.origin === 'number') return `Use at least ${String(i.minimum)}.`
  if (i.code === 'too_big' && i.origin === 'number') return `Use at most ${String(i.maximum)}.`
  if (i.code === 'too_small' && i.origin === 'array') return Number(i.minimum) === 1 ? 'Give at least one value.' : `Give at least ${String(i.minimum)} values.`
  if (i.code === 'too_big' && i.origin === 'array') return `Give at most ${String(i.maximum)} values.`
  if (i.code === 'invalid_type' && (i.expected === 'int' || i.expected === 'number')) return 'Enter a whole number.'
  if (i.code === 'too_small' && i.origin === 'string') return 'Enter a value.'
  return i.message
}

export function useReferenceSetIssues() {
  const issues = ref<IssueMap>({})
  const general = ref('')

  function add(field: string, message: string) {
    const had = issues.value[field]
    if (had === message || had?.includes(message)) return
    issues.value[field] = had ? `${had} ${message}` : message
  }

  function reset() {
    issues.value = {}
    general.value = ''
  }

  function fromZod(list: readonly z.core.$ZodIssue[]) {
    for (const i of list) add(i.path.length ? i.path.map(String).join('.') : 'form', wording(i))
  }

  /** A failed $fetch: a 400/409 with data.issues, or any other error as one message. */
  function fromServer(err: unknown) {
    const e = err as { data?: { message?: string, data?: { issues?: { field: string, message: string }[] } }, statusMessage?: string, message?: string }
    const list = e?.data?.data?.issues
    if (list?.length) for (const i of list) add(i.field, i.message)
    else general.value = e?.data?.message || e?.statusMessage || e?.message || 'The request failed.'
  }

  /** Issues under a prefix (e.g. a whole points part), for fields that collect several paths. */
  function under(prefix: string): string {
    return Object.entries(issues.value)
      .filter(([k]) => k === prefix || k.startsWith(`${prefix}.`))
      .map(([k, m]) => (k === prefix ? m : `${k.slice(prefix.length + 1)}: ${m}`)).join(' ')
  }

  const unplaced = computed(() => Object.entries(issues.value).filter(([k]) => !PLACED.some(re => re.test(k))))
  // Point-by-point issues of one part count once.
  const count = computed(() => new Set(Object.keys(issues.value).map(k => k.replace(/\.points\.\d+(\..*)?$/, '.points'))).size)

  return { issues, general, add, reset, fromZod, fromServer, under, unplaced, count }
}
