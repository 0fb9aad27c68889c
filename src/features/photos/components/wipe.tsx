import { wipeAt } from '../lib/renderer';

/** Drag across the canvas to move the wipe: the colour original on the left, the look on the right. */
export function WipeOverlay({ wipe, onWipe, lookName }: { wipe: number; onWipe: (v: number) => void; lookName?: string }) {
  return (
    <div
      className="absolute inset-0 cursor-ew-resize touch-none"
      data-testid="wipe-area"
      onPointerDown={(e) => {
        (e.target as HTMLElement).setPointerCapture(e.pointerId);
        onWipe(wipeAt(e.clientX, e.currentTarget.getBoundingClientRect()));
      }}
      onPointerMove={(e) => {
        if (e.buttons) onWipe(wipeAt(e.clientX, e.currentTarget.getBoundingClientRect()));
      }}
    >
      <div className="pointer-events-none absolute inset-y-0 w-0.5 bg-paper shadow-[0_0_0_1px_#1d5c7a]" style={{ left: `${wipe * 100}%` }} />
      <span className="pointer-events-none absolute left-2 top-2 rounded bg-paper/85 px-1.5 py-0.5 text-xs">Colour original</span>
      <span className="pointer-events-none absolute right-2 top-2 rounded bg-paper/85 px-1.5 py-0.5 text-xs">{lookName}</span>
    </div>
  );
}

/** The wipe's position by keyboard or slider. */
export function WipeSlider({ wipe, onWipe }: { wipe: number; onWipe: (v: number) => void }) {
  return (
    <div className="mt-2 flex items-center gap-2 text-sm">
      <label htmlFor="wipe-pos" className="text-xs font-medium uppercase tracking-wide text-ink-soft">Wipe</label>
      <input id="wipe-pos" type="range" min={0} max={100} value={Math.round(wipe * 100)} onChange={(e) => onWipe(Number(e.target.value) / 100)} className="w-64 accent-accent" />
      <span className="tabular text-xs text-ink-mute">{Math.round(wipe * 100)} % colour</span>
    </div>
  );
}
