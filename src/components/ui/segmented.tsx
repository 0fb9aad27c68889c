/** A row of toggle buttons of which one is pressed: a small choice between views or modes. */
export function Segmented<T extends string>({ value, options, onChange, label }: { value: T; options: readonly (readonly [T, string])[]; onChange: (v: T) => void; label: string }) {
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
