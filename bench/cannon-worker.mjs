/**
 * Runs one autocannon load in its own process and sends the result back over IPC, so the load
 * generator does not share the measured server's event loop (bench/load.ts forks this).
 * Plain JavaScript: it starts in a few milliseconds without tsx.
 */
import autocannon from 'autocannon'

process.once('message', async ({ paths, ...options }) => {
  let sent = 0
  // `paths`: one after another across all connections, so no path is asked twice until the list wraps.
  if (paths) options.requests = [{ method: 'GET', setupRequest: (req) => ({ ...req, path: paths[sent++ % paths.length] }) }]
  const r = await autocannon(options)
  const result = { requests: r.requests, latency: r.latency, non2xx: r.non2xx, errors: r.errors, wrapped: paths ? sent > paths.length : false }
  process.send(result, () => process.exit(0))
})
