import type { Request, RequestHandler } from 'express';
import type { DataSource, EntityTarget } from 'typeorm';
import type { AppContext } from '../../context';
import { ActivityEntry } from '../../db/entities/activity.entity';
import { Board } from '../../db/entities/board.entity';
import { Curve } from '../../db/entities/curve.entity';
import { Invitation } from '../../db/entities/invitation.entity';
import { Look } from '../../db/entities/look.entity';
import { Membership } from '../../db/entities/membership.entity';
import { Photo } from '../../db/entities/photo.entity';
import { Production } from '../../db/entities/production.entity';
import { Swatch } from '../../db/entities/swatch.entity';
import { logEvent } from '../log';
import type { ActivityAction, ActivityKind } from '../../../shared/schemas/activity';
import type { Role } from '../../../shared/schemas/roles';
import type { ActivityDecision, ActivitySpec } from './activity-routes';

/** One entry to write, as the recorder is given it. */
export interface ActivityRecord {
  productionId: number;
  actorId: number | null;
  actorName: string;
  action: ActivityAction;
  kind: ActivityKind;
  itemId: number | null;
  itemName: string;
  detail: string;
}

/** Names of people and addresses stay out of the operator's log (OWASP Logging Cheat Sheet: no personal data without need). */
const PERSONAL: readonly ActivityKind[] = ['member', 'invitation'];

const clip = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/**
 * Writes activity entries and knows which are still in flight, so a read of the log waits for them: the
 * entries are written after the answer went out, and an owner who just changed something must see it.
 * An entry that cannot be written is not lost silently: the operator's log gets an 'activity-lost' line.
 */
export class ActivityRecorder {
  private pending = new Set<Promise<void>>();
  constructor(private ds: DataSource) {}

  /** Writes one entry (unless `store` is false) and logs it as an operator 'activity' line. */
  record(e: ActivityRecord, store = true): Promise<void> {
    const line = {
      productionId: e.productionId,
      userId: e.actorId,
      action: e.action,
      kind: e.kind,
      itemId: e.itemId,
      ...(PERSONAL.includes(e.kind) ? {} : { itemName: e.itemName }),
      detail: e.detail,
    };
    if (!store) {
      logEvent('activity', line);
      return Promise.resolve();
    }
    const p = this.ds
      .getRepository(ActivityEntry)
      .insert({
        production: { id: e.productionId },
        actor: e.actorId ? { id: e.actorId } : null,
        actorName: clip(e.actorName, 120),
        action: e.action,
        kind: e.kind,
        itemId: e.itemId,
        itemName: clip(e.itemName, 254),
        detail: clip(e.detail, 500),
        at: new Date(),
      })
      .then(
        (r) => logEvent('activity', { entryId: r.identifiers[0]?.id, ...line }),
        (err: unknown) => logEvent('activity-lost', { ...line, error: err instanceof Error ? err.message : String(err) }, 'warn'),
      );
    this.pending.add(p);
    void p.finally(() => this.pending.delete(p));
    return p;
  }

  /**
   * Resolves once every entry started so far is written (or logged as lost). It first lets the event loop
   * turn once, so an answer that just went out has had its 'finish' (where its entry starts).
   */
  async settled(): Promise<void> {
    await new Promise((r) => setImmediate(r));
    await Promise.all([...this.pending]);
  }
}

const recorders = new WeakMap<DataSource, ActivityRecorder>();

/** The recorder of an app's database (one per app). Other modules call `.record()` for writes outside productionRoute. */
export function activityRecorder(ds: DataSource): ActivityRecorder {
  let r = recorders.get(ds);
  if (!r) recorders.set(ds, (r = new ActivityRecorder(ds)));
  return r;
}

const ITEMS: Partial<Record<ActivityKind, EntityTarget<{ name: string }>>> = { look: Look, swatch: Swatch, board: Board, curve: Curve, photo: Photo };

/** The current name of the item `id` of a production (a member's name, an invitation's address), null when there is none. */
async function currentName(ds: DataSource, kind: ActivityKind, productionId: number, id: number): Promise<string | null> {
  if (kind === 'production') return (await ds.getRepository(Production).findOneBy({ id: productionId }))?.name ?? null;
  if (kind === 'member') {
    const m = await ds.getRepository(Membership).findOne({ where: { id, production: { id: productionId } }, relations: { user: true } });
    return m?.user.name ?? null;
  }
  if (kind === 'invitation') return (await ds.getRepository(Invitation).findOneBy({ id, production: { id: productionId } }))?.email ?? null;
  const entity = ITEMS[kind];
  if (!entity) return null;
  return (await ds.getRepository(entity).findOne({ where: { id, production: { id: productionId } } as never }))?.name ?? null;
}

/** The id the route acts on: the production for its own routes, else the last `:param` of the path. */
function targetId(req: Request, kind: ActivityKind, subPath: string, productionId: number): number | null {
  if (kind === 'production') return productionId;
  const params = [...subPath.matchAll(/:([A-Za-z]+)/g)];
  const raw = params.length ? req.params[params[params.length - 1][1]] : undefined;
  const n = Number(raw);
  return Number.isInteger(n) && n > 0 ? n : null;
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => !!v && typeof v === 'object' && !Array.isArray(v);

/** An answered item's name: a member by the person's name, an invitation by its address, else `name`. */
function nameOf(kind: ActivityKind, o: Obj | undefined): string | null {
  if (!o) return null;
  const v = kind === 'member' ? (isObj(o.user) ? o.user.name : undefined) : kind === 'invitation' ? o.email : o.name;
  return typeof v === 'string' ? v : null;
}

/** What the write did, in a few words: the fields a change named (with values for a member's role and department). */
function changeDetail(kind: ActivityKind, body: Obj, oldName: string | null, newName: string | null): string {
  return Object.keys(body)
    .map((k) => {
      if (k === 'name' && oldName && newName && oldName !== newName) return `renamed from '${oldName}'`;
      if (PERSONAL.includes(kind) && typeof body[k] === 'string') return `${k}: ${body[k] as string}`;
      return k;
    })
    .join(', ');
}

interface Before {
  id: number | null;
  name: string | null;
  body: Obj;
}

/** The entry of a write that answered 2xx, from what was known before it and its JSON answer. */
function describeWrite(spec: ActivitySpec, before: Before, answer: unknown): Omit<ActivityRecord, 'productionId' | 'actorId' | 'actorName'> {
  const { kind, action } = spec;
  const item = isObj(answer) && isObj(answer[kind]) ? (answer[kind] as Obj) : undefined;
  const answeredId = typeof item?.id === 'number' ? item.id : null;
  const base = { kind, action, itemId: answeredId ?? before.id, itemName: nameOf(kind, item) ?? before.name ?? '', detail: '' };
  switch (action) {
    case 'created':
      return { ...base, detail: kind === 'invitation' && item ? `as ${String(item.role)} in ${String(item.department)}` : '' };
    case 'changed':
      return { ...base, detail: changeDetail(kind, before.body, before.name, base.itemName) };
    case 'deleted':
      return { ...base, itemId: before.id, itemName: before.name ?? (before.id ? `#${before.id}` : '') };
    case 'duplicated':
      return { ...base, detail: before.name ? `from '${before.name}'` : '' };
    case 'imported': {
      const list = isObj(answer) && Array.isArray(answer.swatches) ? (answer.swatches as unknown[]).filter(isObj) : [];
      const names = list.map((s) => nameOf(kind, s)).filter((s): s is string => !!s);
      return { ...base, itemId: null, itemName: `${list.length} ${list.length === 1 ? kind : `${kind}es`}`, detail: names.join(', ') };
    }
  }
}

/** A refusal by a service after the role check passed (a contributor and another department's item), for the operator. */
function logLateRefusal(req: Request, role: Role, productionId: number): void {
  logEvent('role-refused', {
    userId: req.user?.id ?? null,
    productionId,
    need: role,
    role: req.membership?.role ?? null,
    department: req.membership?.department ?? null,
    reason: 'department',
    method: req.method,
    path: req.originalUrl.split('?')[0],
    ip: req.ip,
  }, 'warn');
}

/**
 * The activity middleware of a production route, right after its role check (`req.membership` is set).
 * For a write with a decision, it notes the target's current name (a deletion leaves nothing to read
 * afterwards) and the fields the body names, keeps the JSON answer, and once the answer went out with a
 * 2xx status writes one entry; a failed write (4xx, 5xx) records nothing. On any route, a 403 given
 * after the role check (the department rule) is logged for the operator as 'role-refused'.
 */
export function recordActivity(ctx: AppContext, route: { subPath: string; role: Role; activity: ActivityDecision | undefined }): RequestHandler {
  const recorder = activityRecorder(ctx.ds);
  const spec = route.activity || null;
  return async (req, res, next) => {
    const productionId = req.membership!.production.id;
    let before: Before | null = null;
    if (spec) {
      const id = targetId(req, spec.kind, route.subPath, productionId);
      let name: string | null = null;
      if (id && spec.action !== 'created' && spec.action !== 'imported') {
        try {
          name = await currentName(ctx.ds, spec.kind, productionId, id);
        } catch (err) {
          logEvent('activity-lookup-failed', { productionId, kind: spec.kind, itemId: id, error: err instanceof Error ? err.message : String(err) }, 'warn');
        }
      }
      before = { id, name, body: isObj(req.body) ? { ...req.body } : {} };
    }
    let answer: unknown;
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      answer = body;
      return json(body);
    };
    res.on('finish', () => {
      if (res.statusCode === 403) logLateRefusal(req, route.role, productionId);
      if (!spec || !before || res.statusCode < 200 || res.statusCode >= 300) return;
      const user = req.user;
      void recorder.record(
        { productionId, actorId: user?.id ?? null, actorName: user?.name ?? 'someone', ...describeWrite(spec, before, answer) },
        spec.store !== false,
      );
    });
    next();
  };
}
