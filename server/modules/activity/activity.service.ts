import { LessThan, type DataSource, type FindOptionsWhere } from 'typeorm';
import { ActivityEntry } from '../../db/entities/activity.entity';
import { ACTIVITY_PAGE_DEFAULT, type ActivityEntryView, type ActivityPage, type ActivityQuery } from '../../../shared/schemas/activity';
import { activityRecorder } from '../../services/activity/activity-recorder';

function entryView(e: ActivityEntry): ActivityEntryView {
  return {
    id: e.id,
    at: new Date(e.at).toISOString(),
    actor: { id: e.actor?.id ?? null, name: e.actorName },
    action: e.action,
    kind: e.kind,
    itemId: e.itemId,
    itemName: e.itemName,
    detail: e.detail,
  };
}

/** A production's activity log, as its owners read it. */
export class ActivityService {
  constructor(private ds: DataSource) {}

  /**
   * One page of the production's entries, newest first (by id, which follows the order of writing),
   * below `before`, filtered by kind and actor; `next` is the `before` of the page after, null at the end.
   * Waits for entries still being written, so a write the reader just made is on the page.
   */
  async list(productionId: number, q: ActivityQuery): Promise<ActivityPage> {
    await activityRecorder(this.ds).settled();
    const limit = q.limit ?? ACTIVITY_PAGE_DEFAULT;
    const where: FindOptionsWhere<ActivityEntry> = { production: { id: productionId } };
    if (q.before) where.id = LessThan(q.before);
    if (q.kind) where.kind = q.kind;
    if (q.actor) where.actor = { id: q.actor };
    const rows = await this.ds.getRepository(ActivityEntry).find({
      where,
      relations: { actor: true },
      select: { id: true, at: true, actorName: true, action: true, kind: true, itemId: true, itemName: true, detail: true, actor: { id: true } },
      order: { id: 'DESC' },
      take: limit + 1,
    });
    const page = rows.slice(0, limit);
    return { entries: page.map(entryView), next: rows.length > limit ? page[page.length - 1].id : null };
  }
}
