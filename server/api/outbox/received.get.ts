// What the local SMTP catcher received (development and tests), for
// administrators: each message with its text and HTML parts. With a real SMTP
// server there is no catcher, and the page says so.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin')
  const url = process.env.PLUMBLINE_CATCHER_URL
  if (!url) return { catcher: null, reachable: false, messages: [] }
  try {
    const r = await $fetch<{ messages: unknown[] }>(`${url.replace(/\/+$/, '')}/messages`, { timeout: 5000 })
    return { catcher: url, reachable: true, messages: r.messages.slice(0, 200) }
  }
  catch (e) {
    return { catcher: url, reachable: false, error: `The mail catcher at ${url} does not answer: ${e instanceof Error ? e.message : String(e)}`, messages: [] }
  }
})
