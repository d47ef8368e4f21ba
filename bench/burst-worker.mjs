/**
 * Fires a list of JSON POSTs all at once from its own process and reports each status and
 * latency, and the time until the last answer (bench/load.ts burst() forks this). node:http,
 * one connection per request as separate phones would have: fetch's own work per request
 * made this client, not the server, the slower side of the race.
 */
import http from 'node:http'

const agent = new http.Agent({ keepAlive: false, maxSockets: Infinity })

function post(url, headers, body) {
  return new Promise((resolve, reject) => {
    const s = performance.now()
    const req = http.request(url, { method: 'POST', agent, headers: { ...headers, 'content-length': Buffer.byteLength(body) } }, (res) => {
      res.on('data', () => {})
      res.on('end', () => resolve({ status: res.statusCode, ms: performance.now() - s }))
    })
    req.on('error', reject)
    req.end(body)
  })
}

process.once('message', async ({ base, cookie, token, posts }) => {
  const headers = { 'content-type': 'application/json', 'accept-encoding': 'gzip', 'x-csrf-token': token, cookie }
  const bodies = posts.map((p) => JSON.stringify(p.body))
  const t0 = performance.now()
  const answers = await Promise.all(posts.map((p, i) => post(base + p.path, headers, bodies[i])))
  process.send({ answers, ms: performance.now() - t0 }, () => process.exit(0))
})
