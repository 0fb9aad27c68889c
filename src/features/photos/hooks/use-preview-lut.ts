import { useEffect, useRef, useState } from 'react';
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import { editsKey, type LookEdits } from '../lib/look-edits';
import { previewEngine } from '../lib/preview-engine';
import type { PreviewLut } from '../lib/preview-protocol';

/** A table with the moment it was asked for (performance.now()), so the canvas can time the whole change. */
export interface TimedLut {
  lut: PreviewLut;
  requestedAt: number;
}

/**
 * The preview table of a look with live edits, built in the worker. While one is being built, later
 * changes wait and only the newest is built next (a dragged slider never queues a backlog).
 * `changedAt` (performance.now() of the input event) starts the latency clock; default: now.
 */
export function usePreviewLut(view: PhotoLookView | undefined, edits: LookEdits, changedAt?: number): { timed: TimedLut | null; error: Error | null } {
  const [timed, setTimed] = useState<TimedLut | null>(null);
  const [error, setError] = useState<Error | null>(null);
  const busy = useRef(false);
  const next = useRef<{ view: PhotoLookView; edits: LookEdits; at: number } | null>(null);
  const alive = useRef(true);
  const key = view ? editsKey(view, edits) : '';

  useEffect(() => {
    alive.current = true;
    return () => {
      alive.current = false;
    };
  }, []);

  useEffect(() => {
    if (!view) return;
    next.current = { view, edits, at: changedAt ?? performance.now() };
    const pump = async () => {
      if (busy.current || !next.current) return;
      const job = next.current;
      next.current = null;
      busy.current = true;
      try {
        const lut = await previewEngine().lut(job.view, job.edits);
        if (alive.current) {
          setTimed({ lut, requestedAt: job.at });
          setError(null);
        }
      } catch (e) {
        if (alive.current) setError(e as Error);
      } finally {
        busy.current = false;
        void pump();
      }
    };
    void pump();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return { timed, error };
}
