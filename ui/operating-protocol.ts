/**
 * Messages between the page and the window-search worker (operating-worker.ts). `job` ties a reply to its request:
 * only the newest request's reply is shown. The report is plain data (structured clone).
 */
import type { WindowReport } from '../sim/index.ts';
import type { WindowWords } from '../sim/index.ts';

export type ToOperating = { readonly type: 'window'; readonly job: number; readonly scenario: unknown };

export type FromOperating =
  | { readonly type: 'done'; readonly job: number; readonly report: WindowReport; readonly words: WindowWords; readonly searchMs: number }
  /** The search does not apply to this scenario (no heat input, heat never off, …): the reason in words. */
  | { readonly type: 'none'; readonly job: number; readonly reason: string }
  | { readonly type: 'failed'; readonly job: number; readonly message: string };
