import type { PhotoView } from '../../../../shared/schemas/photo';

/** The production's photos as thumbnails; the chosen one is marked. */
export function PhotoPicker({ photos, selected, onSelect }: { photos: PhotoView[]; selected: number; onSelect: (id: number) => void }) {
  if (!photos.length) return <p className="text-sm text-ink-mute">No photos yet.</p>;
  return (
    <ul className="grid grid-cols-3 gap-2 lg:grid-cols-2" aria-label="Photos">
      {photos.map((p) => (
        <li key={p.id}>
          <button
            type="button"
            onClick={() => onSelect(p.id)}
            aria-pressed={p.id === selected}
            className={`block w-full overflow-hidden rounded-md border text-left ${p.id === selected ? 'border-accent ring-2 ring-accent' : 'border-paper-line hover:border-ink-mute'}`}
          >
            <img src={p.urls.thumb} alt="" className="aspect-[3/2] w-full bg-paper-sunk object-cover" loading="lazy" />
            <span className="block truncate px-1.5 py-1 text-xs">{p.name}</span>
          </button>
        </li>
      ))}
    </ul>
  );
}
