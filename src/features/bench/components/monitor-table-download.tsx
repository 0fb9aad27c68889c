import { useId, useState } from 'react';
import { MONITOR_TABLE_SIZE, type MonitorTableFormat } from '../../../../shared/look/monitor-table';
import { lookMonitorTableUrl } from '../api/look-monitor-table';

/** Sizes offered (nodes per axis); the API takes any whole number 17..65. */
const SIZES = [MONITOR_TABLE_SIZE.min, MONITOR_TABLE_SIZE.default, MONITOR_TABLE_SIZE.max] as const;
const FORMATS: { value: MonitorTableFormat; label: string }[] = [
  { value: 'cube', label: '.cube' },
  { value: 'clf', label: 'CLF 3' },
];
const select = 'rounded-md border border-paper-line bg-paper-raised px-1.5 py-1 text-sm';

/**
 * Download of a saved look as a 3-D monitoring table for on-set monitors and grading tools (format and
 * nodes per axis). The table is of the look as saved; its input is sRGB-encoded video, not camera log.
 */
export function MonitorTableDownload({ pid, lookId, dirty }: { pid: number; lookId: number; dirty: boolean }) {
  const [format, setFormat] = useState<MonitorTableFormat>('cube');
  const [size, setSize] = useState<number>(MONITOR_TABLE_SIZE.default);
  const id = useId();
  const note = `A 3-D table of the saved look for monitors and grading tools; input sRGB-encoded RGB (not camera log)${dirty ? '. Unsaved changes are not in it' : ''}.`;
  return (
    <span className="inline-flex items-center gap-1" role="group" aria-label="Monitoring table" title={note}>
      <label className="sr-only" htmlFor={`${id}-format`}>Monitoring table format</label>
      <select id={`${id}-format`} className={select} value={format} onChange={(e) => setFormat(e.target.value as MonitorTableFormat)}>
        {FORMATS.map((f) => <option key={f.value} value={f.value}>{f.label}</option>)}
      </select>
      <label className="sr-only" htmlFor={`${id}-size`}>Nodes per axis</label>
      <select id={`${id}-size`} className={select} value={size} onChange={(e) => setSize(Number(e.target.value))}>
        {SIZES.map((n) => <option key={n} value={n}>{n}³</option>)}
      </select>
      <a href={lookMonitorTableUrl(pid, lookId, format, size)} download className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk">
        Monitor table{dirty ? ' (saved)' : ''}
      </a>
    </span>
  );
}
