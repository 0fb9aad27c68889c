import { useRef, useState, type DragEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorMessage } from '../../../components/ui/alert';
import { useUploadPhoto } from '../api/upload-photo';
import type { PhotoView } from '../../../../shared/schemas/photo';

const ACCEPT = 'image/jpeg,image/png,image/tiff,image/webp,.jpg,.jpeg,.png,.tif,.tiff,.webp';

/** Upload by choosing or dropping a file; the server checks the content and answers with a message. */
export function PhotoUploader({ pid, onUploaded }: { pid: number; onUploaded: (p: PhotoView) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadPhoto(pid);
  const [over, setOver] = useState(false);
  const send = (file: File | undefined) => {
    if (!file) return;
    upload.mutate({ pid, file }, { onSuccess: (r) => onUploaded(r.photo) });
  };
  const drop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    send(e.dataTransfer.files[0]);
  };
  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={drop}
      className={`rounded-md border border-dashed p-3 text-sm ${over ? 'border-accent bg-accent-soft' : 'border-paper-line'}`}
    >
      <label htmlFor="photo-file" className="sr-only">Photo file</label>
      <input id="photo-file" ref={input} type="file" accept={ACCEPT} className="sr-only" onChange={(e) => send(e.target.files?.[0] ?? undefined)} />
      <div className="flex flex-wrap items-center gap-2">
        <Button variant="primary" onClick={() => input.current?.click()} disabled={upload.isPending}>
          {upload.isPending ? 'Uploading…' : 'Upload a photo'}
        </Button>
        <span className="text-xs text-ink-mute">JPEG, PNG, TIFF or WebP, 8 or 16 bits, up to 200 MB and 100 megapixels; or drop it here.</span>
      </div>
      {upload.isPending && <progress className="mt-2 h-1 w-full" aria-label="Uploading" />}
      <div className="mt-2"><ErrorMessage error={upload.error} /></div>
    </div>
  );
}
