import type { FormEvent } from 'react';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthForm } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage } from '../../components/ui/alert';
import { useSignIn } from '../../features/auth/api/sign-in';
import { useMe } from '../../features/auth/api/get-me';
import { signInSchema } from '../../../shared/schemas/auth';
import { useFormCheck } from '../../lib/use-form-check';
import { paths } from '../../lib/paths';

export default function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const signIn = useSignIn();
  const { errors, check } = useFormCheck();
  const next = params.get('next') || paths.home();

  if (me.data?.user) return <Navigate to={next} replace />;
  if (me.data?.needsSetup) return <Navigate to={paths.setup()} replace />;

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const input = check(signInSchema, { email: fd.get('email'), password: fd.get('password') });
    if (input) signIn.mutate(input, { onSuccess: () => navigate(next, { replace: true }) });
  }

  return (
    <AuthForm title="Sign in" onSubmit={submit}>
        <TextField label="E-mail" name="email" type="email" autoComplete="username" required error={errors.email} autoFocus />
        <TextField label="Password" name="password" type="password" autoComplete="current-password" required error={errors.password} />
        <ErrorMessage error={signIn.error} />
        <Button type="submit" variant="primary" disabled={signIn.isPending}>{signIn.isPending ? 'Signing in…' : 'Sign in'}</Button>
        <Link to={paths.resetRequest()} className="text-sm text-accent underline">Forgot your password?</Link>
        {me.data?.demo && (
          <p className="text-xs text-ink-mute">
            Demo site: sign in as <code>camera@demo.grisaille.test</code> (the cinematographer) or any demo member, password <code>grisaille-demo</code>.
          </p>
        )}
    </AuthForm>
  );
}
