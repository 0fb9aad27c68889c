import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorMessage } from '../../../components/ui/alert';
import { useStartRender } from '../api/start-render';
import { useRender } from '../api/get-render';
import type { LookDefinitionInput } from '../../../../shared/schemas/look';
import type { RenderFormat } from '../../../../shared/schemas/photo';

const STAGES: Record<string, string> = {
  queued: 'Waiting for the renderer…',
  decoding: 'Reading the original…',
  table: 'Building the look table…',
  rendering: 'Rendering every pixel…',
  encoding: 'Writing the file…',
  done: 'Done',
  failed: 'Failed',
};

/** Full-resolution render of the photo through the look as shown (saved, or with the live changes). */
export function RenderPanel({ pid, photoId, lookId, definition, lookName }: { pid: number; photoId: number; lookId: number; definition: LookDefinitionInput | null; lookName: string }) {
  const [format, setFormat] = useState<RenderFormat>('png16');
  const [key, setKey] = useState('');
  const start = useStartRender();
  const status = useRender(pid, photoId, key);
  const s = status.data?.render ?? (start.data?.render.key === key ? start.data.render : undefined);
  const go = () =>
    start.mutate(definition ? { pid, photoId, look: definition, format } : { pid, photoId, lookId, format }, { onSuccess: (r) => setKey(r.render.key) });
  return (
    <div className="flex flex-col gap-2 text-sm">
      <div className="flex flex-wrap items-center gap-2">
        <label htmlFor="render-format" className="text-xs font-medium uppercase tracking-wide text-ink-soft">Format</label>
        <select id="render-format" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1" value={format} onChange={(e) => setFormat(e.target.value as RenderFormat)}>
          <option value="png16">16-bit PNG</option>
          <option value="jpeg">JPEG</option>
        </select>
        <Button variant="primary" onClick={go} disabled={start.isPending || s?.status === 'running' || s?.status === 'queued'}>Render full resolution</Button>
      </div>
      {definition && <p className="text-xs text-ink-mute">Renders “{lookName}” with the live changes, unsaved.</p>}
      {s && (
        <div aria-live="polite">
          <div className="flex justify-between text-xs text-ink-soft">
            <span>{STAGES[s.stage] ?? s.stage}{s.cached && s.status === 'done' ? ' (from the cache)' : ''}</span>
            <span className="tabular">{Math.round(s.progress * 100)} %</span>
          </div>
          <progress className="h-2 w-full appearance-none overflow-hidden rounded [&::-webkit-progress-bar]:bg-paper-sunk [&::-webkit-progress-value]:bg-accent [&::-moz-progress-bar]:bg-accent" max={1} value={s.progress} aria-label="Render progress" />
          {s.status === 'done' && s.url && (
            <a className="mt-1 inline-block font-medium text-accent underline" href={s.url} download>
              Download {s.format === 'png16' ? '16-bit PNG' : 'JPEG'}{s.bytes ? ` (${(s.bytes / 1e6).toFixed(1)} MB)` : ''}
            </a>
          )}
          {s.status === 'failed' && <p role="alert" className="text-xs text-warn">{s.error}</p>}
        </div>
      )}
      <ErrorMessage error={start.error ?? status.error} />
    </div>
  );
}
