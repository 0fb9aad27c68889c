import { useRef, type KeyboardEvent, type PointerEvent } from 'react';
import type { Rect } from '../lib/region';

/**
 * Read a region: drag a rectangle over the preview (pixels of the preview image). With the overlay focused, the arrow
 * keys move the rectangle and Shift + arrows resize it, 8 px a step.
 */
export function RegionOverlay({ width, height, rect, onRect }: { width: number; height: number; rect: Rect | null; onRect: (r: Rect) => void }) {
  const box = useRef<HTMLDivElement>(null);
  const start = useRef<{ x: number; y: number } | null>(null);
  const toPx = (e: PointerEvent) => {
    const b = box.current!.getBoundingClientRect();
    return { x: Math.round(((e.clientX - b.left) / b.width) * width), y: Math.round(((e.clientY - b.top) / b.height) * height) };
  };
  const clamp = (r: Rect): Rect => {
    const x = Math.max(0, Math.min(width - 1, r.x));
    const y = Math.max(0, Math.min(height - 1, r.y));
    return { x, y, width: Math.max(1, Math.min(width - x, r.width)), height: Math.max(1, Math.min(height - y, r.height)) };
  };
  const fromTo = (a: { x: number; y: number }, b: { x: number; y: number }) => clamp({ x: Math.min(a.x, b.x), y: Math.min(a.y, b.y), width: Math.abs(a.x - b.x) || 1, height: Math.abs(a.y - b.y) || 1 });
  const key = (e: KeyboardEvent) => {
    const d = { ArrowLeft: [-8, 0], ArrowRight: [8, 0], ArrowUp: [0, -8], ArrowDown: [0, 8] }[e.key];
    if (!d) return;
    e.preventDefault();
    const r = rect ?? { x: Math.round(width / 2) - 40, y: Math.round(height / 2) - 40, width: 80, height: 80 };
    onRect(clamp(e.shiftKey ? { ...r, width: r.width + d[0], height: r.height + d[1] } : { ...r, x: r.x + d[0], y: r.y + d[1] }));
  };
  return (
    <div
      ref={box}
      tabIndex={0}
      role="application"
      aria-label="Read a region: drag a rectangle over the photo, or use the arrow keys (Shift to resize)"
      data-testid="region-reader"
      className="absolute inset-0 cursor-crosshair touch-none focus:outline-2 focus:outline-accent"
      onPointerDown={(e) => {
        (e.target as HTMLElement).setPointerCapture(e.pointerId);
        start.current = toPx(e);
      }}
      onPointerMove={(e) => start.current && onRect(fromTo(start.current, toPx(e)))}
      onPointerUp={(e) => {
        if (start.current) onRect(fromTo(start.current, toPx(e)));
        start.current = null;
      }}
      onKeyDown={key}
    >
      {rect && (
        <div
          className="pointer-events-none absolute border-2 border-accent shadow-[0_0_0_1px_rgba(255,255,255,0.8)]"
          style={{ left: `${(rect.x / width) * 100}%`, top: `${(rect.y / height) * 100}%`, width: `${(rect.width / width) * 100}%`, height: `${(rect.height / height) * 100}%` }}
        />
      )}
    </div>
  );
}
