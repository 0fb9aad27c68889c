import { useEffect, useMemo, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { SelectField } from '../../components/ui/field';
import { useProduction } from '../../features/productions/api/get-production';
import { useLooks } from '../../features/looks/api/get-looks';
import { useCreateSwatch } from '../../features/swatches/api/create-swatch';
import { usePhotos } from '../../features/photos/api/get-photos';
import { useDeletePhoto } from '../../features/photos/api/delete-photo';
import { usePhotoLook } from '../../features/photos/api/get-photo-look';
import { useLoadedPhoto, type LoadedPhoto } from '../../features/photos/hooks/use-loaded-photo';
import { usePreviewLut } from '../../features/photos/hooks/use-preview-lut';
import { PhotoUploader } from '../../features/photos/components/photo-uploader';
import { PhotoPicker } from '../../features/photos/components/photo-picker';
import { LookCanvas, type PreviewTiming, type Renderer } from '../../features/photos/components/look-canvas';
import { TunePanel } from '../../features/photos/components/tune-panel';
import { RenderPanel } from '../../features/photos/components/render-panel';
import { SamplerOverlay } from '../../features/photos/components/sampler-overlay';
import { SamplerPanel, type SampleReading } from '../../features/photos/components/sampler-panel';
import { ZoneLegend } from '../../features/photos/components/zone-legend';
import { webgl2Available, type PreviewMode } from '../../features/photos/lib/gl-preview';
import { editedDefinition, hasEdits, type LookEdits } from '../../features/photos/lib/look-edits';
import { meanColour, toneOfColour, type Rect } from '../../features/photos/lib/region';
import { MAX_COMPARE_LOOKS, type LookView } from '../../../shared/schemas/look';
import { roleAtLeast } from '../../../shared/schemas/roles';

type View = 'look' | 'wipe' | 'compare';

function Segmented<T extends string>({ value, options, onChange, label }: { value: T; options: [T, string][]; onChange: (v: T) => void; label: string }) {
  return (
    <div role="group" aria-label={label} className="inline-flex overflow-hidden rounded-md border border-paper-line">
      {options.map(([v, text]) => (
        <button key={v} type="button" aria-pressed={value === v} onClick={() => onChange(v)} className={`px-3 py-1 text-sm ${value === v ? 'bg-ink text-paper' : 'bg-paper-raised text-ink-soft hover:bg-paper-sunk'}`}>
          {text}
        </button>
      ))}
    </div>
  );
}

/** One look of the comparison: its own table, the same photo. */
function CompareCell({ pid, look, loaded, mode, renderer }: { pid: number; look: LookView; loaded: LoadedPhoto; mode: PreviewMode; renderer: Renderer }) {
  const view = usePhotoLook(pid, look.id);
  const { timed, error } = usePreviewLut(view.data?.look, {});
  return (
    <div>
      <p className="mb-1 truncate text-sm font-medium">{look.name}</p>
      <LookCanvas loaded={loaded} size="small" timed={timed} options={{ mode, wipe: null }} renderer={renderer} label={`${loaded.photo.name} through ${look.name}`} />
      <ErrorMessage error={view.error ?? error} />
    </div>
  );
}

export default function PhotosPage() {
  const pid = Number(useParams().productionId);
  const [search, setSearch] = useSearchParams();
  const prod = useProduction(pid);
  const me = prod.data?.production;
  const photos = usePhotos(pid);
  const looks = useLooks(pid);
  const remove = useDeletePhoto(pid);
  const createSwatch = useCreateSwatch(pid);
  const renderer: Renderer = useMemo(() => (search.get('renderer') !== 'cpu' && webgl2Available() ? 'gl' : 'cpu'), [search]);

  const list = photos.data?.photos ?? [];
  const photoId = Number(search.get('photo')) || list[0]?.id || 0;
  const photo = list.find((p) => p.id === photoId) ?? list[0];
  const allLooks = looks.data?.looks ?? [];
  const [lookId, setLookId] = useState(0);
  const look = allLooks.find((l) => l.id === lookId) ?? allLooks[0];
  const [view, setView] = useState<View>('look');
  const [mode, setMode] = useState<PreviewMode>('look');
  const [edits, setEdits] = useState<{ e: LookEdits; at?: number }>({ e: {} });
  const [wipe, setWipe] = useState(0.5);
  const [compare, setCompare] = useState<number[]>([]);
  const [rect, setRect] = useState<Rect | null>(null);
  const [timing, setTiming] = useState<PreviewTiming | null>(null);
  const [kept, setKept] = useState<string | null>(null);

  useEffect(() => {
    if (!compare.length && allLooks.length) setCompare(allLooks.slice(0, Math.min(MAX_COMPARE_LOOKS, 3)).map((l) => l.id));
  }, [allLooks, compare.length]);
  useEffect(() => {
    setEdits({ e: {} });
    setRect(null);
    setKept(null);
  }, [look?.id, photo?.id]);

  const photoLook = usePhotoLook(pid, look?.id ?? 0);
  const { loaded, error: loadError } = useLoadedPhoto(photo);
  const { timed, error: lutError } = usePreviewLut(photoLook.data?.look, edits.e, edits.at);

  const reading: SampleReading | null = useMemo(() => {
    if (!rect || !loaded || !timed || !photo) return null;
    const colour = meanColour(loaded.image, rect);
    const t = toneOfColour(timed.lut, colour);
    const sx = photo.width / loaded.image.width;
    const sy = photo.height / loaded.image.height;
    const full: [number, number, number, number] = [Math.round(rect.x * sx), Math.round(rect.y * sy), Math.max(1, Math.round(rect.width * sx)), Math.max(1, Math.round(rect.height * sy))];
    return { colour, ...t, rect: full };
  }, [rect, loaded, timed, photo]);

  if (prod.isPending || photos.isPending || looks.isPending) return <Spinner />;
  const canUpload = !!me && roleAtLeast(me.myRole, 'contributor');
  const mayChange = !!me && !!photo && (roleAtLeast(me.myRole, 'editor') || (me.myRole === 'contributor' && me.myDepartment === photo.department));
  const selectPhoto = (id: number) => setSearch((s) => {
    const n = new URLSearchParams(s);
    n.set('photo', String(id));
    return n;
  });
  const definition = look && photoLook.data && hasEdits(edits.e) ? editedDefinition(look, photoLook.data.look, edits.e) : null;
  const keep = (v: { name: string; department: NonNullable<typeof me>['myDepartment']; hex: string }) => {
    if (!reading || !photo) return;
    createSwatch.mutate(
      { pid, name: v.name, department: v.department, notes: `Sampled from the photo “${photo.name}”.`, origin: { type: 'photo', photoId: photo.id, rect: reading.rect, colour: { space: 'hex', hex: v.hex } } },
      { onSuccess: (r) => setKept(r.swatch.name) },
    );
  };

  return (
    <>
      <PageHeader title="Photos" subtitle="Reference photos through the looks: live while you retune, side by side, wiped against the colour original, and at full resolution." />
      <div className="grid gap-5 lg:grid-cols-[14rem_minmax(0,1fr)_19rem]">
        <aside className="flex min-w-0 flex-col gap-3" aria-label="Photos of this production">
          {canUpload && <PhotoUploader pid={pid} onUploaded={(p) => selectPhoto(p.id)} />}
          <PhotoPicker photos={list} selected={photo?.id ?? 0} onSelect={selectPhoto} />
        </aside>

        <section className="min-w-0" aria-label="Preview">
          {!photo ? (
            <Notice>No photos yet. {canUpload ? 'Upload one to start.' : 'A contributor can upload one.'}</Notice>
          ) : (
            <>
              <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
                <Segmented label="View" value={view} onChange={setView} options={[['look', 'Look'], ['wipe', 'Wipe'], ['compare', 'Compare']]} />
                <Segmented label="Show" value={mode} onChange={setMode} options={[['look', 'Grey'], ['zones', 'Zones']]} />
              </div>
              <ErrorMessage error={loadError ?? lutError ?? photoLook.error} />
              {!loaded && !loadError && <Spinner label="Loading the preview…" />}
              {loaded && view !== 'compare' && (
                <LookCanvas
                  loaded={loaded}
                  timed={timed}
                  options={{ mode, wipe: view === 'wipe' ? wipe : null }}
                  renderer={renderer}
                  label={`${photo.name} through ${look?.name ?? 'a look'}${view === 'wipe' ? ', wiped against the colour original' : ''}`}
                  onTiming={setTiming}
                >
                  {view === 'look' && <SamplerOverlay width={loaded.image.width} height={loaded.image.height} rect={rect} onRect={setRect} />}
                  {view === 'wipe' && (
                    <div
                      className="absolute inset-0 cursor-ew-resize touch-none"
                      data-testid="wipe-area"
                      onPointerDown={(e) => {
                        (e.target as HTMLElement).setPointerCapture(e.pointerId);
                        const b = e.currentTarget.getBoundingClientRect();
                        setWipe(Math.min(1, Math.max(0, (e.clientX - b.left) / b.width)));
                      }}
                      onPointerMove={(e) => {
                        if (!e.buttons) return;
                        const b = e.currentTarget.getBoundingClientRect();
                        setWipe(Math.min(1, Math.max(0, (e.clientX - b.left) / b.width)));
                      }}
                    >
                      <div className="pointer-events-none absolute inset-y-0 w-0.5 bg-paper shadow-[0_0_0_1px_#1d5c7a]" style={{ left: `${wipe * 100}%` }} />
                      <span className="pointer-events-none absolute left-2 top-2 rounded bg-paper/85 px-1.5 py-0.5 text-xs">Colour original</span>
                      <span className="pointer-events-none absolute right-2 top-2 rounded bg-paper/85 px-1.5 py-0.5 text-xs">{look?.name}</span>
                    </div>
                  )}
                </LookCanvas>
              )}
              {loaded && view === 'wipe' && (
                <div className="mt-2 flex items-center gap-2 text-sm">
                  <label htmlFor="wipe-pos" className="text-xs font-medium uppercase tracking-wide text-ink-soft">Wipe</label>
                  <input id="wipe-pos" type="range" min={0} max={100} value={Math.round(wipe * 100)} onChange={(e) => setWipe(Number(e.target.value) / 100)} className="w-64 accent-accent" />
                  <span className="tabular text-xs text-ink-mute">{Math.round(wipe * 100)} % colour</span>
                </div>
              )}
              {loaded && view === 'compare' && (
                <>
                  <fieldset className="mb-3 flex flex-wrap gap-3 text-sm">
                    <legend className="sr-only">Looks to compare (up to {MAX_COMPARE_LOOKS})</legend>
                    {allLooks.map((l) => {
                      const on = compare.includes(l.id);
                      return (
                        <label key={l.id} className="flex items-center gap-1.5">
                          <input
                            type="checkbox"
                            checked={on}
                            disabled={!on && compare.length >= MAX_COMPARE_LOOKS}
                            onChange={() => setCompare(on ? compare.filter((x) => x !== l.id) : [...compare, l.id])}
                          />
                          {l.name}
                        </label>
                      );
                    })}
                  </fieldset>
                  <div className={`grid gap-3 ${compare.length > 1 ? 'sm:grid-cols-2' : ''}`}>
                    {compare.map((id) => allLooks.find((l) => l.id === id)).filter((l): l is LookView => !!l).map((l) => (
                      <CompareCell key={l.id} pid={pid} look={l} loaded={loaded} mode={mode} renderer={renderer} />
                    ))}
                  </div>
                </>
              )}
              {mode === 'zones' && <div className="mt-3 max-w-xl"><ZoneLegend /></div>}
              {timing && view !== 'compare' && (
                <p className="mt-2 text-xs text-ink-mute tabular" data-testid="preview-timing">
                  Preview {timing.width} × {timing.height} px, {renderer === 'gl' ? 'WebGL2' : 'worker (no WebGL2)'}: {Math.round(timing.total)} ms from the change (table {Math.round(timing.table)} ms).
                </p>
              )}
            </>
          )}
        </section>

        <aside className="flex min-w-0 flex-col gap-4" aria-label="Look and tools">
          <Card>
            <SelectField label="Look" value={look?.id ?? ''} onChange={(e) => setLookId(Number(e.target.value))}>
              {allLooks.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
            </SelectField>
            {photoLook.data && (
              <div className="mt-3">
                <h2 className="mb-2 text-sm font-semibold">Retune live</h2>
                <TunePanel view={photoLook.data.look} edits={edits.e} onChange={(e, at) => setEdits({ e, at })} />
              </div>
            )}
          </Card>
          {photo && look && view === 'look' && (
            <Card>
              <h2 className="mb-2 text-sm font-semibold">Sampler</h2>
              <SamplerPanel
                reading={reading}
                lookName={look.name}
                photoName={photo.name}
                canKeep={canUpload}
                canChooseDepartment={!!me && roleAtLeast(me.myRole, 'editor')}
                myDepartment={me?.myDepartment ?? 'camera'}
                onKeep={keep}
                keeping={createSwatch.isPending}
                error={createSwatch.error}
                kept={kept}
              />
            </Card>
          )}
          {photo && look && (
            <Card>
              <h2 className="mb-2 text-sm font-semibold">Full resolution</h2>
              <p className="mb-2 text-xs text-ink-mute">{photo.width} × {photo.height} px, {photo.bitDepth}-bit {photo.format.toUpperCase()}{photo.iccProfile ? `, profile “${photo.iccProfile}” converted to sRGB` : ', sRGB'}.</p>
              <RenderPanel pid={pid} photoId={photo.id} lookId={look.id} definition={definition} lookName={look.name} />
            </Card>
          )}
          {photo && (
            <Card>
              <h2 className="mb-1 text-sm font-semibold">{photo.name}</h2>
              {photo.notes && <p className="mb-2 text-xs text-ink-soft">{photo.notes}</p>}
              <p className="text-xs text-ink-mute">{photo.department} · {photo.uploadedBy?.name ?? 'unknown'}{photo.isDemo ? ' · invented demo image' : ''}</p>
              <div className="mt-2 flex gap-2">
                <a className="text-xs text-accent underline" href={photo.urls.original} download>Original</a>
                {mayChange && (
                  <Button variant="danger" className="ml-auto" onClick={() => confirm(`Delete the photo “${photo.name}” and its renders?`) && remove.mutate({ pid, id: photo.id })}>Delete</Button>
                )}
              </div>
              <ErrorMessage error={remove.error} />
            </Card>
          )}
        </aside>
      </div>
    </>
  );
}
