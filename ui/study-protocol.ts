/**
 * Messages between the study panel and its Web Workers (study-worker.ts): a batch of points of a sweep plan goes out,
 * one row per point comes back (so the bar moves point by point). `job` ties a reply to its study: a cancelled or
 * replaced study's replies are dropped. Plain data (structured clone).
 */
import type { SweepPlan, SweepRow } from '../sim/index.ts';

export type ToStudy = { readonly type: 'points'; readonly job: number; readonly plan: SweepPlan; readonly indices: readonly number[] };

export type FromStudy =
  | { readonly type: 'row'; readonly job: number; readonly row: SweepRow }
  | { readonly type: 'failed'; readonly job: number; readonly message: string };
