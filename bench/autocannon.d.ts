// The few parts of autocannon 9 that bench/load.ts uses (the package ships no types).
declare module 'autocannon' {
  export interface RequestParams {
    method?: string
    path?: string
    headers?: Record<string, string>
    body?: string
  }
  export interface RequestSpec extends RequestParams {
    setupRequest?: (req: RequestParams, context: Record<string, unknown>) => RequestParams
    onResponse?: (status: number, body: string, context: Record<string, unknown>) => void
  }
  export interface Options {
    url: string
    connections?: number
    duration?: number
    timeout?: number
    headers?: Record<string, string>
    requests?: RequestSpec[]
  }
  export interface Histogram {
    average: number
    p50: number
    p99: number
    max: number
    total: number
  }
  export interface Result {
    requests: Histogram & { sent: number }
    latency: Histogram
    errors: number
    timeouts: number
    non2xx: number
    '2xx': number
    statusCodeStats?: Record<string, { count: number }>
    duration: number
  }
  function autocannon(options: Options): Promise<Result>
  export default autocannon
}
