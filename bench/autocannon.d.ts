/** The part of autocannon 8's API the benchmarks use (the package ships no types). */
declare module 'autocannon' {
  export interface Options {
    url: string
    connections?: number
    duration?: number
    headers?: Record<string, string>
    requests?: { method?: string; path: string }[]
  }
  export interface Result {
    requests: { average: number; total: number }
    latency: { p50: number; p97_5: number; p99: number; average: number }
    non2xx: number
    errors: number
  }
  function autocannon(options: Options): Promise<Result>
  export default autocannon
}
