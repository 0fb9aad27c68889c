import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { ErrorMessage, Notice } from '../../../components/ui/alert';
import { zoneNumeral } from '../../../../shared/tone/zones';
import { DEPARTMENTS, type Department } from '../../../../shared/schemas/roles';
import { toHex, type RegionReading } from '../lib/region';

export type { RegionReading };

const fmtStops = (s: number) => `${s >= 0 ? '+' : '−'}${Math.abs(s).toFixed(1)} stops`;

/** Read a region: the region's mean tone and zone, and a form to keep it as a swatch (its spectrum estimated from the colour). */
export function RegionReadingPanel({ reading, lookName, photoName, canKeep, canChooseDepartment, myDepartment, onKeep, keeping, error, kept }: {
  reading: RegionReading | null;
  lookName: string;
  photoName: string;
  canKeep: boolean;
  canChooseDepartment: boolean;
  myDepartment: Department;
  onKeep: (v: { name: string; department: Department; hex: string }) => void;
  keeping: boolean;
  error: unknown;
  kept: string | null;
}) {
  const [name, setName] = useState('');
  if (!reading) return <p className="text-sm text-ink-mute">Drag a rectangle over the photo to read its mean tone.</p>;
  const hex = toHex(reading.colour);
  const grey = toHex([reading.grey, reading.grey, reading.grey]);
  const submit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    onKeep({ name: String(f.get('name') || `Sample from ${photoName}`), department: (f.get('department') as Department) || myDepartment, hex });
  };
  return (
    <div className="flex flex-col gap-3 text-sm" data-testid="region-reading">
      <div className="flex items-stretch gap-3">
        <div className="flex h-14 w-24 overflow-hidden rounded-md border border-paper-line" aria-hidden="true">
          <span className="flex-1" style={{ background: hex }} />
          <span className="flex-1" style={{ background: grey }} />
        </div>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-xs">
          <dt className="text-ink-mute">Zone</dt><dd className="font-semibold" data-testid="region-zone">{zoneNumeral(reading.zone)}</dd>
          <dt className="text-ink-mute">Tone</dt><dd className="tabular">{fmtStops(reading.stops)}</dd>
          <dt className="text-ink-mute">Colour</dt><dd className="tabular">{hex}</dd>
          <dt className="text-ink-mute">Region</dt><dd className="tabular">{reading.rect[2]} × {reading.rect[3]} px</dd>
        </dl>
      </div>
      <p className="text-xs text-ink-mute">Mean over the region through “{lookName}”.</p>
      {canKeep && (
        <form onSubmit={submit} className="flex flex-col gap-2">
          <TextField label="Swatch name" name="name" value={name} onChange={(e) => setName(e.target.value)} placeholder={`Sample from ${photoName}`} />
          {canChooseDepartment && (
            <SelectField label="Department" name="department" defaultValue={myDepartment}>
              {DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}
            </SelectField>
          )}
          <p className="text-xs text-ink-mute">A photo has no spectrum: the swatch's spectrum is estimated from the region's mean colour.</p>
          <Button type="submit" variant="primary" disabled={keeping} className="self-start">Keep as swatch</Button>
          <ErrorMessage error={error} />
          {kept && <Notice>Kept as swatch “{kept}” (spectrum estimated).</Notice>}
        </form>
      )}
    </div>
  );
}
