import { lazyChart } from '../../../components/ui/lazy-chart';
import type { CurveChartProps } from './curve-chart-drawing';

export type { ChartSeries, CurveChartProps } from './curve-chart-drawing';

/**
 * One or a few curves on 350–900 nm, 220 px high unless told (drawn by curve-chart-drawing.tsx). Loaded when
 * first drawn, so the library page and its forms fetch recharts only once a curve is on screen.
 */
export const CurveChart = lazyChart<CurveChartProps>(() => import('./curve-chart-drawing').then((m) => m.CurveChartDrawing), 220);
