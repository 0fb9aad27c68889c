import type { FormEvent, ReactNode } from 'react';
import { Logo } from '../ui/logo';
import { ZoneRamp } from '../ui/zone-ramp';
import { DemoBanner } from './demo-banner';

/** The frame of the signed-out pages. */
export function AuthLayout({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <DemoBanner />
      <div className="flex flex-1 items-center justify-center p-6">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-2 text-xl font-semibold tracking-tight"><Logo size={28} /> Grisaille</div>
        <div className="rounded-lg border border-paper-line bg-paper-raised p-6">
          <h1 className="mb-4 text-xl">{title}</h1>
          {children}
        </div>
        <div className="mt-6"><ZoneRamp compact /></div>
        <p className="mt-2 text-xs text-ink-mute">How every colour on a black-and-white shoot will read as grey.</p>
      </div>
      </div>
    </div>
  );
}

/** A signed-out page's one form (or, once it has done its job, `done` in its place), with `after` below it. */
export function AuthForm({ title, done, onSubmit, children, after }: { title: string; done?: ReactNode; onSubmit: (e: FormEvent<HTMLFormElement>) => void; children: ReactNode; after?: ReactNode }) {
  return (
    <AuthLayout title={title}>
      {done || (
        <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
          {children}
        </form>
      )}
      {after}
    </AuthLayout>
  );
}
