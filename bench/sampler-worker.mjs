/**
 * Times single GET requests for the benchmark from its own process (bench/load.ts sampler()):
 * one keep-alive connection, as a browser tab has, asking for gzip as browsers do. Each message
 * { id, url, headers } is answered with { id, ms, status } once the whole body has arrived.
 */
import http from 'node:http'

const agent = new http.Agent({ keepAlive: true, maxSockets: 1 })

process.on('message', ({ id, url, headers }) => {
  const t0 = performance.now()
  http.get(url, { agent, headers: { 'accept-encoding': 'gzip', ...headers } }, (res) => {
    res.on('data', () => {})
    res.on('end', () => process.send({ id, ms: performance.now() - t0, status: res.statusCode }))
  }).on('error', (err) => process.send({ id, error: String(err) }))
})
process.on('disconnect', () => process.exit(0))
