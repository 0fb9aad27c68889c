import { lazyChart } from '../../../components/ui/lazy-chart';
import type { CharacteristicCurveChartProps } from './characteristic-curve-chart-drawing';

export type { CharacteristicCurveChartProps, CurveSwatch } from './characteristic-curve-chart-drawing';

/**
 * A medium's characteristic curve with zones and swatches pinned, 300 px high unless told (drawn by
 * characteristic-curve-chart-drawing.tsx). Loaded when first drawn, so the exposure sheet and the bench fetch
 * recharts (and the tone pipeline the drawing samples) only once the curve is on screen.
 */
export const CharacteristicCurveChart = lazyChart<CharacteristicCurveChartProps>(
  () => import('./characteristic-curve-chart-drawing').then((m) => m.CharacteristicCurveChartDrawing),
  300,
);
