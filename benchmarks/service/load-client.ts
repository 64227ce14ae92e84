/**
 * The load generator, run as its own process (`node --import tsx load-client.ts '<spec JSON>'`)
 * so that it does not share an event loop with the app it measures. Sends GET requests with
 * autocannon to `pathTemplate` with `{id}` replaced by ids drawn in turn from a seeded shuffle,
 * each with the next person's Bearer token, and prints one JSON line: throughput, latency
 * percentiles of every answered request (nearest rank over all of them, since autocannon's own
 * histogram reports p97.5 but not p95), and the counts of errors and non-2xx answers.
 */
import autocannon from 'autocannon';
import { loadSpecSchema, type LoadResult } from './load-spec.ts';

/** Nearest-rank percentile of sorted values (Hyndman & Fan 1996, definition 1). */
function percentile(sorted: Float64Array, p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[rank - 1]!;
}

/** A seeded permutation of the ids (mulberry32 driving Fisher–Yates), so runs are repeatable. */
function shuffled(ids: readonly number[], seed: number): number[] {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const out = [...ids];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(next() * (i + 1));
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

async function main(): Promise<void> {
  const spec = loadSpecSchema.parse(JSON.parse(process.argv[2] ?? 'null'));
  const order = shuffled(spec.ids, spec.connections * 7919 + spec.ids.length);
  let turn = 0;
  const latencies: number[] = [];
  let bytes = 0;
  const instance = autocannon({
    url: spec.url,
    connections: spec.connections,
    duration: spec.durationSeconds,
    timeout: 30,
    requests: [
      {
        method: 'GET',
        setupRequest: (request) => {
          const i = turn++;
          return {
            ...request,
            path: spec.pathTemplate.replace('{id}', String(order[i % order.length])),
            headers: { authorization: `Bearer ${spec.tokens[i % spec.tokens.length]}` },
          };
        },
      },
    ],
  });
  instance.on('response', (_client, _status, responseBytes, ms) => {
    latencies.push(ms);
    bytes += responseBytes;
  });
  const result = await instance;
  const sorted = Float64Array.from(latencies).sort();
  const seconds = result.duration;
  const out: LoadResult = {
    requests: latencies.length,
    seconds,
    perSecond: latencies.length / seconds,
    ms: {
      mean: latencies.reduce((s, v) => s + v, 0) / Math.max(1, latencies.length),
      p50: percentile(sorted, 50),
      p95: percentile(sorted, 95),
      p99: percentile(sorted, 99),
      max: sorted.length > 0 ? sorted[sorted.length - 1]! : Number.NaN,
    },
    meanBytes: bytes / Math.max(1, latencies.length),
    non2xx: result.non2xx,
    errors: result.errors,
    timeouts: result.timeouts,
    autocannon: {
      perSecond: result.requests.average,
      p50: result.latency.p50,
      p99: result.latency.p99,
    },
  };
  process.stdout.write(`${JSON.stringify(out)}\n`);
}

await main();
