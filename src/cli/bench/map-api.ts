// Warm latency of the die API against the health check for `npm run bench:map`.
import { median, quantile } from "./map-stats";

export interface LatencySummary {
  medianMs: number;
  p95Ms: number;
  minMs: number;
  maxMs: number;
  requests: number;
  /** Bytes of the last body read. */
  bodyBytes: number;
}

async function timed(url: string, headers: Record<string, string>): Promise<{ ms: number; bytes: number }> {
  const started = performance.now();
  const response = await fetch(url, { headers });
  const body = await response.arrayBuffer();
  const ms = performance.now() - started;
  if (response.status !== 200) throw new Error(`${url} answered ${response.status}: ${new TextDecoder().decode(body).slice(0, 200)}`);
  return { ms, bytes: body.byteLength };
}

/** `warmup` unmeasured requests, then `requests` sequential ones, each timed from send to the last body byte. */
export async function measureLatency(url: string, headers: Record<string, string>, requests = 30, warmup = 5): Promise<LatencySummary> {
  for (let i = 0; i < warmup; i++) await timed(url, headers);
  const times: number[] = [];
  let bodyBytes = 0;
  for (let i = 0; i < requests; i++) {
    const { ms, bytes } = await timed(url, headers);
    times.push(ms);
    bodyBytes = bytes;
  }
  return { medianMs: median(times), p95Ms: quantile(times, 0.95), minMs: Math.min(...times), maxMs: Math.max(...times), requests, bodyBytes };
}
