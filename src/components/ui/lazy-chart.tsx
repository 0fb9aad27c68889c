import { lazy, Suspense, type ComponentType, type JSX } from 'react';
import { Spinner } from './alert';

/**
 * A chart whose drawing code (recharts and what it pulls in, about 370 kB of JavaScript) is fetched only when
 * the chart is first drawn, so the entry bundle, pages without charts and pages whose charts are not open yet
 * never load it. Until it arrives a box of the chart's height holds its place, so the page does not jump.
 * `load` resolves to the drawing component (a dynamic `import()` of the file that imports recharts); the
 * drawing always receives a height (`defaultHeight` px when the caller gives none).
 */
export function lazyChart<P extends { height?: number }>(load: () => Promise<ComponentType<P & { height: number }>>, defaultHeight: number): (props: P) => JSX.Element {
  const Drawing = lazy(async () => ({ default: await load() }));
  function LazyChart(props: P) {
    const height = props.height ?? defaultHeight;
    return (
      <Suspense fallback={<div style={{ height }} className="flex items-center justify-center"><Spinner label="Loading the chart…" /></div>}>
        <Drawing {...props} height={height} />
      </Suspense>
    );
  }
  return LazyChart;
}
