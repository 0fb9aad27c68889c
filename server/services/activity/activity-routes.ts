import type { ActivityAction, ActivityKind } from '../../../shared/schemas/activity';

/** What a production write puts in the activity log. */
export interface ActivitySpec {
  kind: ActivityKind;
  action: ActivityAction;
  /**
   * false: the operator's log line only, no row (a deleted production takes its log with it, so a row
   * could not even be written: its foreign key would point at nothing).
   */
  store?: false;
}

/** A route's decision: what it records, or `false` for a POST that only computes and changes nothing. */
export type ActivityDecision = ActivitySpec | false;

const item = (kind: ActivityKind) => ({
  created: { kind, action: 'created' } as ActivitySpec,
  changed: { kind, action: 'changed' } as ActivitySpec,
  deleted: { kind, action: 'deleted' } as ActivitySpec,
});

/**
 * Every state-changing production route (POST, PUT, PATCH, DELETE under /api/productions/:productionId),
 * keyed by `<method> <sub path>` as the routers register them, with what it records. Reads never record.
 * A non-GET route missing from this table is logged as 'activity-undecided' when it is registered, and
 * tests/api/activity.test.ts fails, so a new write cannot be left out of the log silently: add its line.
 */
export const ACTIVITY_ROUTES: Record<string, ActivityDecision> = {
  // the production itself (productions.router.ts)
  'patch ': item('production').changed,
  'delete ': { ...item('production').deleted, store: false },
  // the team (team.router.ts)
  'patch /members/:memberId': item('member').changed,
  'delete /members/:memberId': item('member').deleted,
  'post /invitations': item('invitation').created,
  'delete /invitations/:invitationId': item('invitation').deleted,
  // looks (looks.router.ts)
  'post /looks': item('look').created,
  'patch /looks/:lookId': item('look').changed,
  'post /looks/:lookId/duplicate': { kind: 'look', action: 'duplicated' },
  'delete /looks/:lookId': item('look').deleted,
  'post /looks/analyse': false,
  'post /looks/light-budget': false,
  // the production's library of curves (library.router.ts)
  'post /curves': item('curve').created,
  'patch /curves/:curveId': item('curve').changed,
  'delete /curves/:curveId': item('curve').deleted,
  // swatches (swatches.router.ts)
  'post /swatches': item('swatch').created,
  'patch /swatches/:swatchId': item('swatch').changed,
  'delete /swatches/:swatchId': item('swatch').deleted,
  'post /swatches/:swatchId/duplicate': { kind: 'swatch', action: 'duplicated' },
  'post /swatches/import': { kind: 'swatch', action: 'imported' },
  'post /swatches/import/preview': false,
  // boards (boards.router.ts)
  'post /boards': item('board').created,
  'patch /boards/:boardId': item('board').changed,
  'delete /boards/:boardId': item('board').deleted,
  // photos (photos.router.ts): renders, uncertainty tables and photo looks are computations
  'post /photos': item('photo').created,
  'patch /photos/:photoId': item('photo').changed,
  'delete /photos/:photoId': item('photo').deleted,
  'post /photos/:photoId/renders': false,
  'post /photo-uncertainty': false,
  'post /photo-looks': false,
};

/**
 * The decision for a production route: reads record nothing; a write takes its line of ACTIVITY_ROUTES;
 * undefined when a write has none (the caller reports it).
 */
export function activityDecision(method: string, subPath: string): ActivityDecision | undefined {
  if (method === 'get') return false;
  return Object.hasOwn(ACTIVITY_ROUTES, `${method} ${subPath}`) ? ACTIVITY_ROUTES[`${method} ${subPath}`] : undefined;
}
