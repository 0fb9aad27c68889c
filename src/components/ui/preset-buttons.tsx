/** A row of presets to start from (pressed when chosen), and the chosen one's note under it. */
export function PresetButtons<P extends { id: string; name: string; note: string }>({ label, presets, chosen, onPick }: {
  label: string;
  presets: readonly P[];
  chosen: P | null | undefined;
  onPick: (preset: P) => void;
}) {
  return (
    <>
      <div className="flex flex-wrap gap-1" aria-label={label}>
        {presets.map((p) => (
          <button key={p.id} type="button" aria-pressed={chosen?.id === p.id} title={p.note} onClick={() => onPick(p)}
            className={`rounded-md border px-2 py-1 text-xs ${chosen?.id === p.id ? 'border-ink bg-ink text-paper' : 'border-paper-line bg-paper-raised hover:bg-paper-sunk'}`}>
            {p.name}
          </button>
        ))}
      </div>
      {chosen && <p className="mt-1 text-xs text-ink-mute">{chosen.note}</p>}
    </>
  );
}
