import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorMessage } from '../../../components/ui/alert';
import { useStartRender } from '../api/start-render';
import { useRender } from '../api/get-render';
import type { LookDefinitionInput } from '../../../../shared/schemas/look';
import type { RenderFormat, RenderStatus } from '../../../../shared/schemas/photo';

const STAGES: Record<string, string> = {
  queued: 'Waiting for the renderer…',
  decoding: 'Reading the original…',
  table: 'Building the look table…',
  rendering: 'Rendering every pixel…',
  encoding: 'Writing the file…',
  done: 'Done',
  failed: 'Failed',
};

/** What a render is of: the photo, the look (saved, or its live changes) and the format. */
const renderTarget = (photoId: number, lookId: number, format: RenderFormat, definition: LookDefinitionInput | null) =>
  `${photoId}|${lookId}|${format}|${definition ? JSON.stringify(definition) : 'saved'}`;

/** The file's route, named after the look (the server adds "retuned" when the live changes were rendered). */
const namedUrl = (url: string, lookId: number) => `${url.split('?')[0]}?look=${lookId}`;

/**
 * Full-resolution render of the photo through the look as shown (saved, or with the live changes). Only a
 * render of the current photo × look × format (× live changes) is shown: another choice shows none, and
 * never polls a render of another photo.
 */
export function RenderPanel({ pid, photoId, lookId, definition, lookName }: { pid: number; photoId: number; lookId: number; definition: LookDefinitionInput | null; lookName: string }) {
  const [format, setFormat] = useState<RenderFormat>('png16');
  const [started, setStarted] = useState<{ target: string; photoId: number; key: string; first: RenderStatus; lookName: string; retuned: boolean } | null>(null);
  const [asked, setAsked] = useState('');
  const start = useStartRender();
  const target = renderTarget(photoId, lookId, format, definition);
  const mine = started?.target === target ? started : null;
  const status = useRender(pid, mine?.photoId ?? 0, mine?.key ?? '');
  const s = mine ? (status.data?.render.key === mine.key ? status.data.render : mine.first) : undefined;
  const go = () => {
    const at = { target, photoId, lookName, retuned: !!definition };
    setAsked(target);
    start.mutate(definition ? { pid, photoId, look: definition, format } : { pid, photoId, lookId, format }, {
      onSuccess: (r) => setStarted({ ...at, key: r.render.key, first: r.render }),
    });
  };
  const busy = (start.isPending && asked === target) || s?.status === 'running' || s?.status === 'queued';
  const formatName = (f: RenderFormat) => (f === 'png16' ? '16-bit PNG' : 'JPEG');
  const of = mine ? `“${mine.lookName}”${mine.retuned ? ' with the live changes' : ''}` : '';
  return (
    <div className="flex flex-col gap-2 text-sm">
      <div className="flex flex-wrap items-center gap-2">
        <label htmlFor="render-format" className="text-xs font-medium uppercase tracking-wide text-ink-soft">Format</label>
        <select id="render-format" className="rounded-md border border-paper-line bg-paper-raised px-2 py-1" value={format} onChange={(e) => setFormat(e.target.value as RenderFormat)}>
          <option value="png16">16-bit PNG</option>
          <option value="jpeg">JPEG</option>
        </select>
        <Button variant="primary" onClick={go} disabled={busy}>Render full resolution</Button>
      </div>
      {definition && <p className="text-xs text-ink-mute">Renders “{lookName}” with the live changes, unsaved.</p>}
      {s && mine && (
        <div aria-live="polite" data-testid="render-status" data-look={mine.lookName}>
          <p className="mb-1 text-xs font-medium text-ink-soft">Render of {of}, {formatName(s.format)}</p>
          <div className="flex justify-between text-xs text-ink-soft">
            <span>{STAGES[s.stage] ?? s.stage}{s.cached && s.status === 'done' ? ' (from the cache)' : ''}</span>
            <span className="tabular">{Math.round(s.progress * 100)} %</span>
          </div>
          <progress className="h-2 w-full appearance-none overflow-hidden rounded [&::-webkit-progress-bar]:bg-paper-sunk [&::-webkit-progress-value]:bg-accent [&::-moz-progress-bar]:bg-accent" max={1} value={s.progress} aria-label="Render progress" />
          {s.status === 'done' && s.url && (
            <a className="mt-1 inline-block font-medium text-accent underline" href={namedUrl(s.url, lookId)} download>
              Download {formatName(s.format)} of {of}{s.bytes ? ` (${(s.bytes / 1e6).toFixed(1)} MB)` : ''}
            </a>
          )}
          {s.status === 'failed' && <p role="alert" className="text-xs text-warn">{s.error}</p>}
        </div>
      )}
      <ErrorMessage error={(mine ? status.error : null) ?? (asked === target ? start.error : null)} />
    </div>
  );
}
