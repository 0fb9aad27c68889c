import { useState } from 'react';
import { PageHeader, Card } from '../../components/ui/card';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { useOutbox } from '../../features/outbox/api/get-outbox';

/** Demo mode: every message the fake SMTP server received. Site admin only. */
export default function OutboxPage() {
  const q = useOutbox();
  const [open, setOpen] = useState<number | null>(null);
  return (
    <>
      <PageHeader title="Outbox" subtitle="Demo mode: mail goes to a local fake SMTP server and lands here instead of being delivered." />
      {q.isPending && <Spinner />}
      <ErrorMessage error={q.error} />
      {q.data?.messages.length === 0 && <p className="text-ink-soft">No mail sent yet.</p>}
      <div className="flex flex-col gap-3">
        {q.data?.messages.map((m) => (
          <Card key={m.id}>
            <button type="button" className="w-full text-left" onClick={() => setOpen(open === m.id ? null : m.id)} aria-expanded={open === m.id}>
              <div className="flex flex-wrap justify-between gap-2">
                <strong>{m.subject}</strong>
                <span className="text-xs text-ink-mute">{new Date(m.createdAt + (m.createdAt.endsWith('Z') ? '' : 'Z')).toLocaleString()}</span>
              </div>
              <div className="text-sm text-ink-soft">to {m.to}</div>
            </button>
            {open === m.id && <pre className="mt-3 whitespace-pre-wrap rounded bg-paper-sunk p-3 text-xs">{m.text}</pre>}
          </Card>
        ))}
      </div>
    </>
  );
}
