import { Button } from '../../../components/ui/button';
import { ErrorMessage } from '../../../components/ui/alert';
import type { PhotoView } from '../../../../shared/schemas/photo';
import { uprightSize } from '../lib/photo-size';

/** Where the photo came from, its original, and (for those who may) its deletion. */
export function PhotoDetails({ photo, mayDelete, onDelete, error }: { photo: PhotoView; mayDelete: boolean; onDelete: () => void; error: unknown }) {
  return (
    <>
      <h2 className="mb-1 text-sm font-semibold">{photo.name}</h2>
      {photo.notes && <p className="mb-2 text-xs text-ink-soft">{photo.notes}</p>}
      <p className="text-xs text-ink-mute">{photo.department} · {photo.uploadedBy?.name ?? 'unknown'}{photo.isDemo ? ' · invented demo image' : ''}</p>
      <div className="mt-2 flex gap-2">
        <a className="text-xs text-accent underline" href={photo.urls.original} download>Original</a>
        {mayDelete && (
          <Button variant="danger" className="ml-auto" onClick={() => confirm(`Delete the photo “${photo.name}” and its renders?`) && onDelete()}>Delete</Button>
        )}
      </div>
      <ErrorMessage error={error} />
    </>
  );
}

/** One line on the photo's pixels and colour profile. */
export function photoFormatLine(photo: PhotoView): string {
  const { width, height } = uprightSize(photo);
  return `${width} × ${height} px, ${photo.bitDepth}-bit ${photo.format.toUpperCase()}${photo.iccProfile ? `, profile “${photo.iccProfile}” converted to sRGB` : ', sRGB'}.`;
}
