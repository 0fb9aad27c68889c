/** The authorship part of an item's view: who made it (null once their account is gone) and when, ISO 8601. */
export function authoredView(row: { createdBy?: { id: number; name: string } | null; createdAt: Date | string; updatedAt: Date | string }): {
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
} {
  return {
    createdBy: row.createdBy ? { id: row.createdBy.id, name: row.createdBy.name } : null,
    createdAt: new Date(row.createdAt).toISOString(),
    updatedAt: new Date(row.updatedAt).toISOString(),
  };
}
