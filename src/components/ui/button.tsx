import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';
const styles: Record<Variant, string> = {
  primary: 'bg-accent text-white hover:bg-accent-strong disabled:opacity-50',
  secondary: 'bg-paper-raised text-ink border border-paper-line hover:bg-paper-sunk disabled:opacity-50',
  ghost: 'text-ink-soft hover:bg-paper-sunk disabled:opacity-50',
  danger: 'bg-paper-raised text-warn border border-warn/40 hover:bg-warn-soft disabled:opacity-50',
};

export function Button({ variant = 'secondary', className = '', type = 'button', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type={type} className={`inline-flex items-center gap-1.5 rounded-md px-3 py-1.5 text-sm font-medium transition-colors ${styles[variant]} ${className}`} {...rest} />;
}
