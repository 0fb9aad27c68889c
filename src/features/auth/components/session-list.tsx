import { Button } from '../../../components/ui/button';
import { ErrorMessage, Notice, Spinner } from '../../../components/ui/alert';
import { useSessions } from '../api/get-sessions';
import { useEndSession } from '../api/end-session';
import { browserLabel } from '../lib/browser-label';
import { useEndOtherSessions } from '../api/end-other-sessions';

const when = (iso: string) => new Date(iso).toLocaleString();

/** The user's signed-in sessions (browser, address, since, last seen); ends one or all the others. */
export function SessionList() {
  const q = useSessions();
  const end = useEndSession();
  const endOthers = useEndOtherSessions();
  const sessions = q.data?.sessions ?? [];
  const others = sessions.filter((s) => !s.current).length;

  return (
    <div className="flex flex-col gap-3">
      {q.isPending && <Spinner />}
      <ErrorMessage error={q.error ?? end.error ?? endOthers.error} />
      <ul className="divide-y divide-paper-line text-sm">
        {sessions.map((s) => (
          <li key={s.id} className="flex items-start justify-between gap-3 py-2">
            <div className="min-w-0">
              <div className="truncate font-medium" title={s.userAgent}>{browserLabel(s.userAgent)}</div>
              <div className="text-xs text-ink-mute">
                {s.ip || 'unknown address'} · signed in {when(s.createdAt)} · last seen {when(s.lastSeenAt)}
              </div>
            </div>
            {s.current ? (
              <span className="shrink-0 rounded-md bg-accent-soft px-2 py-0.5 text-xs text-ink">This browser</span>
            ) : (
              <Button variant="ghost" className="shrink-0" disabled={end.isPending} onClick={() => end.mutate(s.id)}>End</Button>
            )}
          </li>
        ))}
      </ul>
      {endOthers.isSuccess && <Notice>{endOthers.data.ended === 1 ? 'One other session was signed out.' : `${endOthers.data.ended} other sessions were signed out.`}</Notice>}
      {others > 0 && (
        <Button variant="danger" className="self-start" disabled={endOthers.isPending} onClick={() => endOthers.mutate()}>
          Sign out everywhere else
        </Button>
      )}
    </div>
  );
}
