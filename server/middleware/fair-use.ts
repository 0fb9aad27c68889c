/**
 * Fair use of the heavy computations (simulate, shade): per signed-in user, at most N heavy ones at once
 * (FAIR_USE_CONCURRENCY, default 2) and a budget of work per minute (FAIR_USE_WORK_PER_MINUTE, in swatches
 * simulated; a shade counts 50, shade.service.ts). A request past either answers 429 with Retry-After (RFC 6585 §4,
 * RFC 9110 §10.2.3), so one person's batch cannot take every thread of the compute pool from the others.
 * A light request (less work than HEAVY_WORK: the shade page's one-surface simulations, sent in parallel, one
 * per look) is not counted against the concurrency, only against the minute's budget.
 *
 * The limits live behind `FairUseLimiter` (acquire a grant, release it when the computation ends), kept in
 * memory here; a limiter shared by several server processes (Redis, say) implements the same interface.
 * The grant is released when the computation settles (`endFairUse`, called by computeRoute), not when the
 * client goes away: a client that gives up does not free the thread its computation still holds.
 */
import type { RequestHandler, Response } from 'express';
import { RetryLaterError } from '../errors';
import { UnauthenticatedError } from '../errors';

/** Seconds a client is told to wait while its own computations run (a 2,000-swatch simulation takes about 0.5 s). */
const BUSY_RETRY_AFTER_S = 1;
const MINUTE_MS = 60_000;
/** Work from which a request is heavy and counts against the concurrency: 50 swatches (tens of ms), or a shade. */
export const HEAVY_WORK = 50;

/** A grant: hold it while the computation runs. A refusal: why, in words for a person, and when to retry. */
export type FairUseGrant = { ok: true; release(): void } | { ok: false; code: 'busy' | 'over_budget'; message: string; retryAfterS: number };

/** Fair-use limits per key (a user id): one acquire per computation, one release when it ends. */
export interface FairUseLimiter {
  acquire(key: string, work: number): Promise<FairUseGrant>;
}

export interface FairUseOptions {
  /** computations one key may have running at once */
  concurrency: number;
  /** work one key may ask for in any 60 s; 0 = no budget */
  workPerMinute: number;
  /** work from which a request counts against `concurrency` (default HEAVY_WORK) */
  heavyWork?: number;
  /** clock, ms (tests) */
  now?: () => number;
}

const plural = (n: number, one: string, many: string) => `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;

/** The limiter of one server process: running counts and the last minute's work per key, in memory. */
export class MemoryFairUse implements FairUseLimiter {
  private readonly running = new Map<string, number>();
  /** per key: [time ms, work] of the last minute's granted computations, oldest first */
  private readonly spent = new Map<string, [number, number][]>();
  private readonly now: () => number;

  constructor(private readonly opts: FairUseOptions) {
    this.now = opts.now ?? Date.now;
  }

  async acquire(key: string, work: number): Promise<FairUseGrant> {
    const { concurrency, workPerMinute, heavyWork = HEAVY_WORK } = this.opts;
    const heavy = work >= heavyWork;
    const running = this.running.get(key) ?? 0;
    if (heavy && running >= concurrency) {
      return { ok: false, code: 'busy', message: `You already have ${plural(running, 'computation', 'computations')} running; wait for one to finish.`, retryAfterS: BUSY_RETRY_AFTER_S };
    }
    const t = this.now();
    const window = (this.spent.get(key) ?? []).filter(([at]) => t - at < MINUTE_MS);
    const used = window.reduce((a, [, w]) => a + w, 0);
    // a single request larger than the whole budget still runs when nothing else was asked for this minute
    if (workPerMinute > 0 && used > 0 && used + work > workPerMinute) {
      // when enough of the minute's work has aged out for this request to fit
      let freed = 0;
      let at = window[0][0];
      for (const [when, w] of window) {
        freed += w;
        at = when;
        if (used - freed + work <= workPerMinute) break;
      }
      const retryAfterS = Math.max(1, Math.ceil((at + MINUTE_MS - t) / 1000));
      this.spent.set(key, window);
      return {
        ok: false,
        code: 'over_budget',
        message: `You have used this minute's share of computation (${plural(workPerMinute, "swatch's", "swatches'")} worth); try again in ${plural(retryAfterS, 'second', 'seconds')}.`,
        retryAfterS,
      };
    }
    if (workPerMinute > 0) this.spent.set(key, [...window, [t, work]]);
    if (!heavy) return { ok: true, release: () => {} };
    this.running.set(key, running + 1);
    let released = false;
    return {
      ok: true,
      release: () => {
        if (released) return;
        released = true;
        const n = (this.running.get(key) ?? 1) - 1;
        if (n > 0) this.running.set(key, n);
        else this.running.delete(key);
      },
    };
  }

  /** Heavy computations running for `key` now (tests, diagnostics). */
  runningFor(key: string): number {
    return this.running.get(key) ?? 0;
  }
}

const RELEASE = Symbol('fair-use release');
type Locals = { [RELEASE]?: () => void };

/**
 * Takes a fair-use grant for the signed-in user before a heavy computation (after the body is validated,
 * so a refused body costs nothing); `work(body)` is what the request asks for. Refusals are 429s with
 * Retry-After; the route calls `endFairUse(res)` when the computation settles.
 */
export function fairUse(limiter: FairUseLimiter, work: (body: unknown) => number = () => 1): RequestHandler {
  return (req, res, next) => {
    if (!req.user) return next(new UnauthenticatedError());
    limiter.acquire(String(req.user.id), Math.max(1, work(req.body))).then(
      (grant) => {
        if (!grant.ok) {
          res.set('Retry-After', String(grant.retryAfterS));
          return next(new RetryLaterError(429, grant.code, grant.message, grant.retryAfterS));
        }
        (res.locals as Locals)[RELEASE] = grant.release;
        next();
      },
      next,
    );
  };
}

/** Ends the request's fair-use grant, if it has one (idempotent). */
export function endFairUse(res: Response): void {
  const locals = res.locals as Locals;
  locals[RELEASE]?.();
  delete locals[RELEASE];
}
