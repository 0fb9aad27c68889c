import { useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Notice, Spinner } from '../../components/ui/alert';
import { SelectField } from '../../components/ui/field';
import { useMember } from '../../features/productions/hooks/use-member';
import { useLooks } from '../../features/looks/api/get-looks';
import { useCreateSwatch } from '../../features/swatches/api/create-swatch';
import { usePhotos } from '../../features/photos/api/get-photos';
import { useDeletePhoto } from '../../features/photos/api/delete-photo';
import { usePhotoSession } from '../../features/photos/hooks/use-photo-session';
import { PhotoUploader } from '../../features/photos/components/photo-uploader';
import { PhotoPicker } from '../../features/photos/components/photo-picker';
import { PhotoPreview, type PhotoViewMode } from '../../features/photos/components/photo-preview';
import { PhotoDetails, photoFormatLine } from '../../features/photos/components/photo-details';
import { TunePanel } from '../../features/photos/components/tune-panel';
import { RenderPanel } from '../../features/photos/components/render-panel';
import { RegionReadingPanel } from '../../features/photos/components/region-reading-panel';
import { chooseRenderer } from '../../features/photos/lib/renderer';
import { mayAddItems, mayChangeDepartmentItem, roleAtLeast } from '../../../shared/policy/department';
import type { Department } from '../../../shared/schemas/roles';

export default function PhotosPage() {
  const pid = Number(useParams().productionId);
  const [search, setSearch] = useSearchParams();
  const { production, member } = useMember(pid);
  const photos = usePhotos(pid);
  const looks = useLooks(pid);
  const remove = useDeletePhoto(pid);
  const createSwatch = useCreateSwatch(pid);
  const renderer = chooseRenderer(search.get('renderer'));

  const list = photos.data?.photos ?? [];
  const photoId = Number(search.get('photo')) || list[0]?.id || 0;
  const photo = list.find((p) => p.id === photoId) ?? list[0];
  const allLooks = looks.data?.looks ?? [];
  const [lookId, setLookId] = useState(0);
  const look = allLooks.find((l) => l.id === lookId) ?? allLooks[0];
  const [view, setView] = useState<PhotoViewMode>('look');
  const session = usePhotoSession(pid, photo, look);
  const { reading } = session;

  if (production.isPending || photos.isPending || looks.isPending) return <Spinner />;
  const canUpload = mayAddItems(member);
  const selectPhoto = (id: number) => setSearch((s) => {
    const n = new URLSearchParams(s);
    n.set('photo', String(id));
    return n;
  });
  const keep = (v: { name: string; department: Department; hex: string }) => {
    if (!reading || !photo) return;
    createSwatch.mutate(
      { pid, name: v.name, department: v.department, notes: `Sampled from the photo “${photo.name}”.`, origin: { type: 'photo', photoId: photo.id, rect: reading.rect, colour: { space: 'hex', hex: v.hex } } },
      { onSuccess: (r) => session.setKept(r.swatch.name) },
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
            <PhotoPreview pid={pid} photo={photo} look={look} looks={allLooks} loaded={session.loaded} timed={session.timed} error={session.error}
              loading={!session.loaded && !session.loadError} renderer={renderer} view={view} onView={setView} rect={session.rect} onRect={session.setRect} definition={session.definition} />
          )}
        </section>

        <aside className="flex min-w-0 flex-col gap-4" aria-label="Look and tools">
          <Card>
            <SelectField label="Look" value={look?.id ?? ''} onChange={(e) => setLookId(Number(e.target.value))}>
              {allLooks.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
            </SelectField>
            {session.photoLook.data && (
              <div className="mt-3">
                <h2 className="mb-2 text-sm font-semibold">Retune live</h2>
                <TunePanel view={session.photoLook.data.look} edits={session.edits} onChange={session.setEdits} />
              </div>
            )}
          </Card>
          {photo && look && view === 'look' && (
            <Card>
              <h2 className="mb-2 text-sm font-semibold">Read a region</h2>
              <RegionReadingPanel reading={reading} lookName={look.name} photoName={photo.name} canKeep={canUpload}
                canChooseDepartment={!!member && roleAtLeast(member.role, 'editor')} myDepartment={member?.department ?? 'camera'}
                onKeep={keep} keeping={createSwatch.isPending} error={createSwatch.error} kept={session.kept} />
            </Card>
          )}
          {photo && look && (
            <Card>
              <h2 className="mb-2 text-sm font-semibold">Full resolution</h2>
              <p className="mb-2 text-xs text-ink-mute">{photoFormatLine(photo)}</p>
              <RenderPanel pid={pid} photoId={photo.id} lookId={look.id} definition={session.definition} lookName={look.name} />
            </Card>
          )}
          {photo && (
            <Card>
              <PhotoDetails photo={photo} mayDelete={mayChangeDepartmentItem(member, photo.department)} onDelete={() => remove.mutate({ pid, id: photo.id })} error={remove.error} />
            </Card>
          )}
        </aside>
      </div>
    </>
  );
}
