import { webgl2Available } from './gl-preview';
import type { Renderer } from '../components/look-canvas';

let gl2: boolean | undefined;

/** The live preview's renderer: WebGL2 when the browser has it (asked once), unless `?renderer=cpu` asks for the worker. */
export function chooseRenderer(asked: string | null): Renderer {
  if (asked === 'cpu') return 'cpu';
  gl2 ??= webgl2Available();
  return gl2 ? 'gl' : 'cpu';
}

/** Where a pointer at `clientX` sits across `box`, 0..1 (the wipe's position). */
export function wipeAt(clientX: number, box: DOMRect): number {
  return Math.min(1, Math.max(0, (clientX - box.left) / box.width));
}
