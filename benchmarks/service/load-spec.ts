import { z } from 'zod';

/** What the load client (load-client.ts, its own process) is asked to do, as one JSON argument. */
export const loadSpecSchema = z.strictObject({
  url: z.url(),
  /** `{id}`, where present, is replaced by the next id. */
  pathTemplate: z.string().startsWith('/'),
  ids: z.array(z.number().int().positive()).min(1),
  tokens: z.array(z.string().min(1)).min(1),
  connections: z.number().int().min(1).max(1000),
  durationSeconds: z.number().min(0.5).max(600),
});
export type LoadSpec = z.infer<typeof loadSpecSchema>;

/** What it prints. */
export const loadResultSchema = z.object({
  requests: z.number(),
  seconds: z.number(),
  perSecond: z.number(),
  ms: z.object({
    mean: z.number(),
    p50: z.number(),
    p95: z.number(),
    p99: z.number(),
    max: z.number(),
  }),
  meanBytes: z.number(),
  non2xx: z.number(),
  errors: z.number(),
  timeouts: z.number(),
  /** autocannon's own figures from its histogram, for comparison. */
  autocannon: z.object({ perSecond: z.number(), p50: z.number(), p99: z.number() }),
});
export type LoadResult = z.infer<typeof loadResultSchema>;
