import { useState, type FormEvent } from 'react';
import { Navigate, useNavigate } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage } from '../../components/ui/alert';
import { useSetup } from '../../features/auth/api/setup';
import { useMe } from '../../features/auth/api/get-me';
import { setupSchema } from '../../../shared/schemas/auth';
import { zodFieldErrors } from '../../lib/form-errors';
import { paths } from '../../lib/paths';

/** The first account on an empty site; it becomes the site admin. */
export default function SetupPage() {
  const me = useMe();
  const setup = useSetup();
  const navigate = useNavigate();
  const [errors, setErrors] = useState<Record<string, string>>({});
  if (me.data && !me.data.needsSetup) return <Navigate to={paths.home()} replace />;
  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const parsed = setupSchema.safeParse(Object.fromEntries(fd));
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    setup.mutate(parsed.data, { onSuccess: () => navigate(paths.home()) });
  }
  return (
    <AuthLayout title="Create the first account">
      <p className="mb-4 text-sm text-ink-soft">This site has no accounts yet. The first one is the site admin; everyone else joins by invitation.</p>
      <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
        <TextField label="Name" name="name" error={errors.name} />
        <TextField label="E-mail" name="email" type="email" error={errors.email} />
        <TextField label="Password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password} />
        <ErrorMessage error={setup.error} />
        <Button type="submit" variant="primary" disabled={setup.isPending}>Create account</Button>
      </form>
    </AuthLayout>
  );
}
