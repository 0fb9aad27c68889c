import { useEffect, useRef, useState } from 'react';
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import { editsKey, type LookEdits } from '../lib/look-edits';
import { previewEngine } from '../lib/preview-engine';
import type { PreviewLut, PreviewQuality } from '../lib/preview-protocol';

/** A table with the moment it was asked for (performance.now()), so the canvas can time the whole change. */
export interface TimedLut {
  lut: PreviewLut;
  requestedAt: number;
}

/** How long a slider rests before its small table is replaced by the full one, ms (a pause between steps of a drag is shorter). */
export const REST_MS = 150;

type Job = { view: PhotoLookView; edits: LookEdits; at: number; quality: PreviewQuality };

/**
 * The preview table of a look with live edits, built in the worker. A change from an input (`changedAt`
 * given: performance.now() of the input event, which starts the latency clock) is drawn first from the
 * small table, then from the full one once the input has rested REST_MS; other changes (a look or photo
 * chosen), and every change when `drag` is false (the worker's CPU renderer, for which a small table
 * would cost a whole frame of its own), get the full table at once. While one is being built, later
 * changes wait and only the newest is built next (a dragged slider never queues a backlog).
 */
export function usePreviewLut(view: PhotoLookView | undefined, edits: LookEdits, changedAt?: number, drag = true): { timed: TimedLut | null; error: Error | null } {
  const [timed, setTimed] = useState<TimedLut | null>(null);
  const [error, setError] = useState<Error | null>(null);
  const busy = useRef(false);
  const next = useRef<Job | null>(null);
  const rest = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const alive = useRef(true);
  const key = view ? editsKey(view, edits) : '';

  useEffect(() => {
    alive.current = true;
    return () => {
      alive.current = false;
      clearTimeout(rest.current);
    };
  }, []);

  useEffect(() => {
    if (!view) return;
    clearTimeout(rest.current);
    next.current = { view, edits, at: changedAt ?? performance.now(), quality: changedAt === undefined || !drag ? 'full' : 'drag' };
    const pump = async () => {
      if (busy.current || !next.current) return;
      const job = next.current;
      next.current = null;
      busy.current = true;
      let drawnSmall = false;
      try {
        const lut = await previewEngine().lut(job.view, job.edits, job.quality);
        drawnSmall = lut.quality === 'drag';
        if (alive.current) {
          setTimed({ lut, requestedAt: job.at });
          setError(null);
        }
      } catch (e) {
        if (alive.current) setError(e as Error);
      } finally {
        busy.current = false;
        if (next.current) void pump();
        else if (drawnSmall && alive.current) {
          rest.current = setTimeout(() => {
            if (next.current || !alive.current) return;
            next.current = { ...job, quality: 'full' };
            void pump();
          }, REST_MS);
        }
      }
    };
    void pump();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return { timed, error };
}
