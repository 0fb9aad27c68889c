import { useState, type FormEvent } from 'react';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage } from '../../components/ui/alert';
import { useSignIn } from '../../features/auth/api/sign-in';
import { useMe } from '../../features/auth/api/get-me';
import { signInSchema } from '../../../shared/schemas/auth';
import { zodFieldErrors } from '../../lib/form-errors';

export default function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const signIn = useSignIn();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const next = params.get('next') || '/';

  if (me.data?.user) return <Navigate to={next} replace />;
  if (me.data?.needsSetup) return <Navigate to="/setup" replace />;

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const parsed = signInSchema.safeParse({ email: fd.get('email'), password: fd.get('password') });
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    signIn.mutate(parsed.data, { onSuccess: () => navigate(next, { replace: true }) });
  }

  return (
    <AuthLayout title="Sign in">
      <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
        <TextField label="E-mail" name="email" type="email" autoComplete="username" required error={errors.email} autoFocus />
        <TextField label="Password" name="password" type="password" autoComplete="current-password" required error={errors.password} />
        <ErrorMessage error={signIn.error} />
        <Button type="submit" variant="primary" disabled={signIn.isPending}>{signIn.isPending ? 'Signing in…' : 'Sign in'}</Button>
        <Link to="/reset" className="text-sm text-accent underline">Forgot your password?</Link>
        {me.data?.demo && (
          <p className="text-xs text-ink-mute">
            Demo site: sign in as <code>camera@demo.grisaille.test</code> (the cinematographer) or any demo member, password <code>grisaille-demo</code>.
          </p>
        )}
      </form>
    </AuthLayout>
  );
}
