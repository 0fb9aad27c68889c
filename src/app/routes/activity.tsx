import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { SelectField } from '../../components/ui/field';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useActivity } from '../../features/activity/api/get-activity';
import { ActivityTable } from '../../features/activity/components/activity-table';
import { kindPlural } from '../../features/activity/lib/entry-sentence';
import { ACTIVITY_KINDS, activityKindSchema, type ActivityKind } from '../../../shared/schemas/activity';

/** The production's activity log, for its owners: who created, changed or deleted what, and when. */
export default function ActivityPage() {
  const pid = Number(useParams().productionId);
  const prod = useProduction(pid);
  const isOwner = prod.data?.production.myRole === 'owner';
  const [kind, setKind] = useState<ActivityKind | undefined>(undefined);
  const log = useActivity(pid, { kind }, isOwner);
  const entries = log.data?.pages.flatMap((p) => p.entries) ?? [];

  return (
    <>
      <PageHeader title="Activity" subtitle="Who created, changed or deleted which look, swatch, board, curve, photo, member or invitation, and when. Newest first." />
      {prod.isPending && <Spinner />}
      {prod.data && !isOwner && <Notice>The activity log is for the production's owners.</Notice>}
      {isOwner && (
        <>
          <div className="mb-4 max-w-xs">
            <SelectField label="Show" value={kind ?? ''} onChange={(e) => { const k = activityKindSchema.safeParse(e.target.value); setKind(k.success ? k.data : undefined); }}>
              <option value="">Everything</option>
              {ACTIVITY_KINDS.map((k) => <option key={k} value={k}>{kindPlural(k)}</option>)}
            </SelectField>
          </div>
          <ErrorMessage error={log.error} />
          {log.isPending ? <Spinner /> : entries.length === 0 ? <p className="text-sm text-ink-mute">Nothing yet.</p> : <ActivityTable entries={entries} />}
          {log.hasNextPage && (
            <div className="mt-4">
              <Button onClick={() => void log.fetchNextPage()} disabled={log.isFetchingNextPage}>{log.isFetchingNextPage ? 'Loading…' : 'Older'}</Button>
            </div>
          )}
        </>
      )}
    </>
  );
}
