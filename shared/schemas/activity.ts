import { z } from 'zod';

/** What an activity entry is about: the production itself or one of its items, members or invitations. */
export const ACTIVITY_KINDS = ['production', 'look', 'swatch', 'board', 'curve', 'photo', 'member', 'invitation'] as const;
export type ActivityKind = (typeof ACTIVITY_KINDS)[number];
export const activityKindSchema = z.enum(ACTIVITY_KINDS);

/** What was done: the three CRUD verbs, and the two writes that make items from others (duplicate, file import). */
export const ACTIVITY_ACTIONS = ['created', 'changed', 'deleted', 'duplicated', 'imported'] as const;
export type ActivityAction = (typeof ACTIVITY_ACTIONS)[number];

/** Page size of `GET /api/productions/:id/activity`. */
export const ACTIVITY_PAGE_DEFAULT = 50;
export const ACTIVITY_PAGE_MAX = 200;

/** A positive whole number given as a query string. */
const idText = (what: string) =>
  z.string().regex(/^[1-9]\d{0,9}$/, `Give ${what} as a whole number above 0.`).transform(Number);

/**
 * The query of `GET /api/productions/:id/activity`: `before` (an entry id; the page starts below it),
 * `limit` (1..200, default 50), `kind` and `actor` (a user id) filter. Unknown keys are refused.
 */
export const activityQuerySchema = z
  .object({
    before: idText('before (an entry id)').optional(),
    limit: z
      .string()
      .regex(/^\d{1,4}$/, `Give limit as a whole number from 1 to ${ACTIVITY_PAGE_MAX}.`)
      .transform(Number)
      .refine((n) => n >= 1 && n <= ACTIVITY_PAGE_MAX, `Give limit as a whole number from 1 to ${ACTIVITY_PAGE_MAX}.`)
      .optional(),
    kind: z.enum(ACTIVITY_KINDS, { message: `Give kind as one of: ${ACTIVITY_KINDS.join(', ')}.` }).optional(),
    actor: idText('actor (a user id)').optional(),
  })
  .strict();
export type ActivityQuery = z.output<typeof activityQuerySchema>;

/** One entry as the API answers it. */
export interface ActivityEntryView {
  id: number;
  /** ISO 8601 */
  at: string;
  actor: { id: number | null; name: string };
  action: ActivityAction;
  kind: ActivityKind;
  itemId: number | null;
  itemName: string;
  /** e.g. the changed fields of a PATCH: "name, filters" */
  detail: string;
}

/** One page: newest first; `next` is the `before` of the following page, null at the end. */
export interface ActivityPage {
  entries: ActivityEntryView[];
  next: number | null;
}
