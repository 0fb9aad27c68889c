import type { ReactNode } from 'react';
import { Sparkline } from './sparkline';

interface Props {
  step: string;
  title: ReactNode;
  values?: number[];
  fixedMax?: number;
  sparkLabel?: string;
  children?: ReactNode;
  actions?: ReactNode;
  last?: boolean;
}

/** One card of the light path, with its spectral sparkline; cards are joined by a line into a vertical chain. */
export function PathCard({ step, title, values, fixedMax, sparkLabel, children, actions, last }: Props) {
  return (
    <li className="relative pl-6">
      <span aria-hidden="true" className="absolute left-2 top-0 h-full w-px bg-paper-line" style={last ? { height: '1.25rem' } : undefined} />
      <span aria-hidden="true" className="absolute left-[0.3rem] top-4 h-2.5 w-2.5 rounded-full border-2 border-ink bg-paper" />
      <section className="mb-3 rounded-lg border border-paper-line bg-paper-raised p-3" aria-label={`${step}: ${typeof title === 'string' ? title : ''}`}>
        <header className="mb-2 flex items-start justify-between gap-2">
          <div className="min-w-0">
            <p className="text-[10px] font-semibold uppercase tracking-widest text-ink-mute">{step}</p>
            <h3 className="truncate text-sm font-semibold">{title}</h3>
          </div>
          <div className="flex items-center gap-1">
            {values && <Sparkline values={values} fixedMax={fixedMax} label={sparkLabel ?? `spectrum of ${step}`} />}
            {actions}
          </div>
        </header>
        {children}
      </section>
    </li>
  );
}
