import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

const control = 'w-full rounded-md border border-paper-line bg-paper-raised px-2.5 py-1.5 text-sm text-ink placeholder:text-ink-mute focus:border-accent focus:outline-none aria-[invalid=true]:border-warn';

interface Wrap {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
}

/** What every control of a field gets: its id, its invalid state, the error it is described by, the look. */
interface ControlProps {
  id: string;
  'aria-invalid': boolean;
  'aria-describedby'?: string;
  className: string;
}

/** A labelled control with its hint or error below; `control` draws the input, select or text area. */
function Field({ label, error, hint, id, control: draw }: Wrap & { id?: string; control: (p: ControlProps) => ReactNode }) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={fid} className="text-xs font-medium uppercase tracking-wide text-ink-soft">{label}</label>
      {draw({ id: fid, 'aria-invalid': !!error, 'aria-describedby': error ? `${fid}-err` : undefined, className: control })}
      {hint && !error && <p className="text-xs text-ink-mute">{hint}</p>}
      {error && <p id={`${fid}-err`} role="alert" className="text-xs text-warn">{error}</p>}
    </div>
  );
}

export function TextField({ label, error, hint, id, ...rest }: Wrap & InputHTMLAttributes<HTMLInputElement>) {
  return <Field label={label} error={error} hint={hint} id={id} control={(p) => <input {...p} {...rest} />} />;
}

export function SelectField({ label, error, hint, id, children, ...rest }: Wrap & SelectHTMLAttributes<HTMLSelectElement>) {
  return <Field label={label} error={error} hint={hint} id={id} control={(p) => <select {...p} {...rest}>{children}</select>} />;
}

export function TextAreaField({ label, error, hint, id, ...rest }: Wrap & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return <Field label={label} error={error} hint={hint} id={id} control={(p) => <textarea {...p} {...rest} />} />;
}
