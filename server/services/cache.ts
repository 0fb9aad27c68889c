/**
 * Small in-memory caches for what every request reads again (issue 15): the role check's membership, the
 * signed-in user, each look's composed pipeline. One module so they share one policy:
 *
 * - bounded, least recently used first out (a Map keeps insertion order; a hit moves its key to the end);
 * - `tableCache` entries are dropped on every write to the tables they were read from, seen through a
 *   TypeORM subscriber of the app's DataSource (inserts, updates and removes through entities, repositories
 *   and query builders, and any rolled-back transaction), so a changed role, a removed member or a deleted
 *   production is never answered from here; rows that SQLite deletes by cascade go with the write that
 *   caused it (a production or user removed is itself a write seen here). A load that overlaps a write is
 *   not kept (a generation count), so it cannot put back what the write replaced;
 * - a short lifetime on top bounds what a write from outside this process could leave unseen (the restore
 *   script refuses while a server runs, so none is expected).
 *
 * The caches are per process: a server started as several processes would need its writes announced
 * across them before these could stay on.
 *
 * `GRISAILLE_NO_CACHE=1` (or `setCachesEnabled(false)`, as bench/api.bench.ts does for its "before"
 * figures) turns them all off: every read goes to the database and every look is composed again.
 */
import type { DataSource, EntitySubscriberInterface } from 'typeorm';

// the one switch of this module, read once here (a bench and diagnosis setting, not configuration)
let enabled = process.env.GRISAILLE_NO_CACHE !== '1';

/** Whether the caches of this module keep anything. */
export function cachesEnabled(): boolean {
  return enabled;
}

/** Turns every cache of this module on or off (off also forgets what they hold, at their next use). */
export function setCachesEnabled(on: boolean): void {
  enabled = on;
}

/** A bounded map that forgets its least recently used entry first; entries older than `ttlMs` are misses. */
export class LruCache<K, V> {
  private map = new Map<K, { value: V; at: number }>();
  constructor(readonly max: number, readonly ttlMs = Infinity) {}

  get size(): number {
    return this.map.size;
  }

  get(key: K): V | undefined {
    if (!enabled) {
      if (this.map.size) this.map.clear();
      return undefined;
    }
    const hit = this.map.get(key);
    if (!hit) return undefined;
    if (performance.now() - hit.at > this.ttlMs) {
      this.map.delete(key);
      return undefined;
    }
    this.map.delete(key);
    this.map.set(key, hit);
    return hit.value;
  }

  set(key: K, value: V): void {
    if (!enabled) return;
    this.map.delete(key);
    if (this.map.size >= this.max) this.map.delete(this.map.keys().next().value!);
    this.map.set(key, { value, at: performance.now() });
  }

  delete(key: K): void {
    this.map.delete(key);
  }

  clear(): void {
    this.map.clear();
  }
}

/** An entity class, as TypeORM names a table's rows (`event.metadata.target`). */
// eslint-disable-next-line @typescript-eslint/no-unsafe-function-type
type EntityClass = Function;

/** A cache of rows read from some tables, emptied on any write to them (see `tableCache`). */
export class TableCache<K, V> {
  private lru: LruCache<K, V>;
  /** bumped by every write to a watched table: a load that started before it is not kept */
  private generation = 0;
  constructor(readonly watches: readonly EntityClass[], max: number, ttlMs: number) {
    this.lru = new LruCache(max, ttlMs);
  }

  /** The value for `key`, loaded with `load` when not held; `null`/`undefined` answers are not kept. */
  async get(key: K, load: () => Promise<V | null | undefined>): Promise<V | null | undefined> {
    const hit = this.lru.get(key);
    if (hit !== undefined) return hit;
    const generation = this.generation;
    const value = await load();
    if (value !== null && value !== undefined && generation === this.generation) this.lru.set(key, value);
    return value;
  }

  /** Forgets everything (a watched table was written). */
  clear(): void {
    this.generation++;
    this.lru.clear();
  }

  get size(): number {
    return this.lru.size;
  }
}

const cachesOf = new WeakMap<DataSource, TableCache<unknown, unknown>[]>();

/** One subscriber per DataSource: clears the caches that watch the table written, or all on a rollback. */
function watch(ds: DataSource): TableCache<unknown, unknown>[] {
  let caches = cachesOf.get(ds);
  if (caches) return caches;
  const list: TableCache<unknown, unknown>[] = (caches = []);
  const written = (target: unknown) => {
    for (const c of list) if (c.watches.some((e) => e === target || (typeof target === 'function' && Object.prototype.isPrototypeOf.call(e.prototype, target.prototype)))) c.clear();
  };
  const subscriber: EntitySubscriberInterface = {
    afterInsert: (e) => written(e.metadata.target),
    afterUpdate: (e) => written(e.metadata.target),
    afterRemove: (e) => written(e.metadata.target),
    afterSoftRemove: (e) => written(e.metadata.target),
    afterRecover: (e) => written(e.metadata.target),
    // a reader on SQLite's one connection may have seen the rolled-back rows; forget them
    afterTransactionRollback: () => list.forEach((c) => c.clear()),
  };
  // DataSource.initialize() builds this list from its options; subscribers added after it are called too
  ds.subscribers.push(subscriber);
  cachesOf.set(ds, caches);
  return caches;
}

/**
 * A cache of values read from the tables of `watches` through `ds`, emptied whenever one of them is
 * written through `ds` (TypeORM events; see the module comment). At most `max` entries, each kept at
 * most `ttlMs`.
 */
export function tableCache<K, V>(ds: DataSource, watches: readonly EntityClass[], opts: { max: number; ttlMs: number }): TableCache<K, V> {
  const c = new TableCache<K, V>(watches, opts.max, opts.ttlMs);
  watch(ds).push(c as TableCache<unknown, unknown>);
  return c;
}

/** A shallow copy with the same prototype (an entity stays an entity), so a caller cannot change the kept one. */
export function shallowCopy<T extends object>(o: T): T {
  return Object.assign(Object.create(Object.getPrototypeOf(o) as object) as T, o);
}
