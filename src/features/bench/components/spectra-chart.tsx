import { lazyChart } from '../../../components/ui/lazy-chart';
import type { SpectraChartProps } from './spectra-chart-drawing';

export type { SpectraChartProps } from './spectra-chart-drawing';

/**
 * The curves of a look's light path and their product, 280 px high unless told (drawn by
 * spectra-chart-drawing.tsx). Loaded when first drawn, so recharts is fetched only once an analysis is shown.
 */
export const SpectraChart = lazyChart<SpectraChartProps>(() => import('./spectra-chart-drawing').then((m) => m.SpectraChartDrawing), 280);
