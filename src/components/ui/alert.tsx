import type { ReactNode } from 'react';
import { ApiError } from '../../lib/api-client';

/** Shows an error (typically an ApiError) as a message; nothing when there is none. */
export function ErrorMessage({ error }: { error: unknown }) {
  if (!error) return null;
  const msg = error instanceof ApiError || error instanceof Error ? error.message : String(error);
  return <p role="alert" className="rounded-md border border-warn/40 bg-warn-soft px-3 py-2 text-sm text-warn">{msg}</p>;
}

export function Notice({ children, tone = 'info' }: { children: ReactNode; tone?: 'info' | 'caution' }) {
  const cls = tone === 'caution' ? 'border-warn/40 bg-warn-soft text-ink' : 'border-accent/30 bg-accent-soft text-ink';
  return <div className={`rounded-md border px-3 py-2 text-sm ${cls}`}>{children}</div>;
}

export function Spinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <p className="flex items-center gap-2 text-sm text-ink-mute" role="status">
      <span className="inline-block h-3 w-3 animate-spin rounded-full border-2 border-ink-mute border-t-transparent" />
      {label}
    </p>
  );
}
