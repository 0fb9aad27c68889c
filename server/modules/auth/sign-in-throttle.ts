import crypto from 'node:crypto';

/**
 * Where failed sign-ins are counted, per account key. In memory for now (one server process); a shared
 * store (e.g. Redis, when rate limits move there) implements the same three calls.
 */
export interface FailureStore {
  /** the key's failure times (ms), oldest first, at or after `since` */
  recent(key: string, since: number): Promise<number[]>;
  add(key: string, at: number): Promise<void>;
  clear(key: string): Promise<void>;
}

/** A Map of the last `keep` failure times per key; stale keys are dropped as the map grows. */
export class MemoryFailureStore implements FailureStore {
  private times = new Map<string, number[]>();
  constructor(private keep: number, private windowMs: number, private pruneAbove = 10_000) {}

  async recent(key: string, since: number): Promise<number[]> {
    return (this.times.get(key) ?? []).filter((t) => t >= since);
  }
  async add(key: string, at: number): Promise<void> {
    const list = [...(this.times.get(key) ?? []), at].slice(-this.keep);
    this.times.set(key, list);
    if (this.times.size > this.pruneAbove) this.prune(at);
  }
  async clear(key: string): Promise<void> {
    this.times.delete(key);
  }
  private prune(now: number): void {
    for (const [k, list] of this.times) if (list[list.length - 1] < now - this.windowMs) this.times.delete(k);
  }
}

/** An account's key: sha256 of the normalised e-mail (also what the operator's log shows instead of the address). */
export function emailHash(email: string): string {
  return crypto.createHash('sha256').update(email.trim().toLowerCase()).digest('hex').slice(0, 16);
}

export interface ThrottleOptions {
  /** failed sign-ins allowed in the window (default 10) */
  max?: number;
  /** the window (default 15 minutes) */
  windowMs?: number;
  store?: FailureStore;
}

/**
 * Per-account sign-in throttle: after `max` failed sign-ins within `windowMs` for one account (by
 * normalised e-mail, whatever the client address, whether or not the account exists so the answer does
 * not reveal accounts), the account answers 429 until enough failures leave the window. A success clears
 * the count. Common practice; OWASP ASVS 4.0.3 §2.2.1 (anti-automation against credential guessing).
 */
export class SignInThrottle {
  readonly max: number;
  readonly windowMs: number;
  private store: FailureStore;

  constructor(opts: ThrottleOptions = {}) {
    this.max = opts.max ?? 10;
    this.windowMs = opts.windowMs ?? 15 * 60 * 1000;
    this.store = opts.store ?? new MemoryFailureStore(this.max, this.windowMs);
  }

  /** Milliseconds until the account may try again; 0 when it may try now. */
  async lockedForMs(email: string, now = Date.now()): Promise<number> {
    const times = await this.store.recent(emailHash(email), now - this.windowMs);
    if (times.length < this.max) return 0;
    // free again once the failure that made the count reach `max` leaves the window
    return times[times.length - this.max] + this.windowMs - now;
  }

  async failed(email: string, now = Date.now()): Promise<void> {
    await this.store.add(emailHash(email), now);
  }

  async succeeded(email: string): Promise<void> {
    await this.store.clear(emailHash(email));
  }
}
