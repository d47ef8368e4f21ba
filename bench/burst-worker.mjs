/**
 * Fires a list of JSON POSTs all at once from its own process and reports each status and
 * latency, and the time until the last answer (bench/load.ts burst() forks this).
 */
process.once('message', async ({ base, cookie, token, posts }) => {
  const headers = { 'content-type': 'application/json', 'x-csrf-token': token, cookie }
  const t0 = performance.now()
  const answers = await Promise.all(posts.map(async ({ path, body }) => {
    const s = performance.now()
    const res = await fetch(base + path, { method: 'POST', headers, body: JSON.stringify(body) })
    await res.arrayBuffer()
    return { status: res.status, ms: performance.now() - s }
  }))
  process.send({ answers, ms: performance.now() - t0 }, () => process.exit(0))
})
