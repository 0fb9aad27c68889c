import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

const control = 'w-full rounded-md border border-paper-line bg-paper-raised px-2.5 py-1.5 text-sm text-ink placeholder:text-ink-mute focus:border-accent focus:outline-none aria-[invalid=true]:border-warn';

interface Wrap {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
}

function FieldShell({ id, label, error, hint, children }: Wrap & { id: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium uppercase tracking-wide text-ink-soft">{label}</label>
      {children}
      {hint && !error && <p className="text-xs text-ink-mute">{hint}</p>}
      {error && <p id={`${id}-err`} role="alert" className="text-xs text-warn">{error}</p>}
    </div>
  );
}

export function TextField({ label, error, hint, id, ...rest }: Wrap & InputHTMLAttributes<HTMLInputElement>) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <FieldShell id={fid} label={label} error={error} hint={hint}>
      <input id={fid} aria-invalid={!!error} aria-describedby={error ? `${fid}-err` : undefined} className={control} {...rest} />
    </FieldShell>
  );
}

export function SelectField({ label, error, hint, id, children, ...rest }: Wrap & SelectHTMLAttributes<HTMLSelectElement>) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <FieldShell id={fid} label={label} error={error} hint={hint}>
      <select id={fid} aria-invalid={!!error} className={control} {...rest}>{children}</select>
    </FieldShell>
  );
}

export function TextAreaField({ label, error, hint, id, ...rest }: Wrap & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <FieldShell id={fid} label={label} error={error} hint={hint}>
      <textarea id={fid} aria-invalid={!!error} className={control} {...rest} />
    </FieldShell>
  );
}
