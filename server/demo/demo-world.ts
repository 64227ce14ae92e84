import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import type { DemoPeople } from './demo-people.ts';
import type { DemoRoutineKey } from './demo-routines.ts';
import type { DemoQueue, DemoTrialRunner } from './demo-trials.ts';

/** Everything the story's events act on, and what they leave behind. */
export interface DemoWorld {
  db: Db;
  env: Env;
  people: DemoPeople;
  routines: Map<DemoRoutineKey, number>;
  queue: DemoQueue;
  trials: DemoTrialRunner;
  /** Candidate ids by the story's keys. */
  candidates: Map<string, number>;
  /** The promotion that made each candidate the incumbent, by the story's key. */
  promotions: Map<string, number>;
  /** Trials left queued for the worker. */
  leftQueued: number[];
}

/** The id the story's key stands for; a key used before it is made is a mistake in the story. */
export function idOf<K extends string>(map: Map<K, number>, key: K, what: string): number {
  const id = map.get(key);
  if (id === undefined) throw new Error(`the demo story names ${what} ${key} before creating it`);
  return id;
}
