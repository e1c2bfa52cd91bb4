import { suggestColumnMapping } from '../../../shared/parse'

// Submit one output table for one version against one reference set: from a
// signed-in qa/admin, or from CI with a per-code token of scope `submit`.
export default defineEventHandler(async (event) => {
  const caller = await requireAccess(event, { roles: ['qa', 'admin'], scopes: ['submit'] })
  const upload = await readUpload(event)
  const fields = submissionFields(upload)
  const code = await findCode(fields.code)
  requireCodeAccess(caller, code.id)
  const set = fields.setId !== undefined ? await loadSet(fields.setId) : await loadNewestRevision(fields.set!)
  if (set.state !== 'ready') throw httpError(409, 'not_ready', `Reference set ${set.slug} r${set.revision} is ${set.state}; submit once it is ready.`)

  const sha = sha256Hex(upload.data)
  const version = await findVersion(code.id, fields.version)
  const fillsBuild = version ? checkBuild(version, fields) !== null : false
  if (version) {
    const dup = await findDuplicateRun(version.id, set.id, sha)
    if (dup) return { run: { id: dup.id, counts: dup.counts }, duplicate: true }
  }
  // a large table waits for its turn (server/utils/large-table-turn.ts)
  const stored = await inLargeTableTurn(upload.data.length, async () => {
    const clock = stepClock()
    // the cases are read while the table is parsed; a refused table drops them
    const loading = loadCases(set.id)
    loading.catch(() => {})
    await new Promise(resolve => setImmediate(resolve)) // let the query go out before the parse takes the CPU
    const table = parseUploadedTable(upload.data)
    clock('parse')
    const { index, mapping } = resolveMapping(set, table, fields.mapping, (c, p) => suggestColumnMapping(c, p).mapping)
    const cases = await loading
    clock('load cases')
    const judged = judgeTable(set, cases, table, index)
    const actor = caller.actor
    const run = await storeRun({
      set, codeId: code.id, versionLabel: fields.version, versionId: version?.id ?? null, commit: fields.commit, environment: fields.environment, fillsBuild,
      fileName: upload.fileName, data: upload.data, sha, mapping, judged, actor, tokenId: caller.token?.id ?? null,
    })
    clock('judge and store')
    return run
  })
  setResponseStatus(event, stored.duplicate ? 200 : 201)
  return { run: { id: stored.id, counts: stored.counts }, duplicate: stored.duplicate }
})
