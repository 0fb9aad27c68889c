import { useEffect, useMemo, useState } from 'react';
import type { LookDefinitionInput } from '../../../../shared/schemas/look';
import type { PhotoLookRequestInput, UncertaintyStatus } from '../../../../shared/schemas/photo';
import { useStartUncertainty } from '../api/start-uncertainty';
import { useUncertainty } from '../api/get-uncertainty';

/** Live changes settle this long before their table is asked for, ms. */
const SETTLE_MS = 500;

export interface UncertaintyTable {
  key: string;
  size: number;
  widths: Float32Array;
}

/**
 * The uncertainty table of the look shown (saved, or with the live changes once they settle), asked for
 * only while `on`: its status while it builds (for the progress bar) and the table once done.
 */
export function useUncertaintyTable(pid: number, lookId: number | undefined, definition: LookDefinitionInput | null, on: boolean) {
  const defKey = definition ? JSON.stringify(definition) : '';
  // keyed on the definition's content: the page builds a new object for the same look on every render
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const wanted = useMemo<PhotoLookRequestInput | null>(() => (!on || !lookId ? null : definition ? { look: definition } : { lookId }), [on, lookId, defKey]);
  const [choice, setChoice] = useState<PhotoLookRequestInput | null>(wanted);
  useEffect(() => {
    if (!wanted || 'lookId' in wanted) {
      setChoice(wanted);
      return;
    }
    const t = setTimeout(() => setChoice(wanted), SETTLE_MS);
    return () => clearTimeout(t);
  }, [wanted]);

  const start = useStartUncertainty(pid, choice);
  const started = start.data?.uncertainty;
  const poll = useUncertainty(pid, started?.key ?? '', !!started && started.status === 'running');
  const status: UncertaintyStatus | undefined = started?.status === 'running' ? (poll.data?.uncertainty ?? started) : started;
  const table = useMemo<UncertaintyTable | null>(
    () => (status?.status === 'done' && status.widths ? { key: status.key, size: status.size, widths: Float32Array.from(status.widths) } : null),
    [status],
  );
  return { status: choice ? status : undefined, table, pending: !!choice && !status, error: start.error ?? poll.error };
}
