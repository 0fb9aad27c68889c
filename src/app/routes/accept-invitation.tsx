import { useState, type FormEvent } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { useInvitation } from '../../features/auth/api/get-invitation';
import { useAcceptInvitation } from '../../features/auth/api/accept-invitation';
import { acceptInvitationSchema } from '../../../shared/schemas/auth';
import { apiFieldError, zodFieldErrors } from '../../lib/form-errors';
import { paths } from '../../lib/paths';

export default function AcceptInvitationPage() {
  const { token = '' } = useParams();
  const inv = useInvitation(token);
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const [errors, setErrors] = useState<Record<string, string>>({});
  if (inv.isPending) return <AuthLayout title="Invitation"><Spinner /></AuthLayout>;
  if (inv.isError) return <AuthLayout title="Invitation"><ErrorMessage error={inv.error} /></AuthLayout>;
  const i = inv.data.invitation;

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const raw = { password: fd.get('password'), ...(i.hasAccount ? {} : { name: fd.get('name') }) };
    const parsed = acceptInvitationSchema.safeParse(raw);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    accept.mutate({ token, ...parsed.data }, {
      onSuccess: (r) => navigate(paths.production(r.productionId).root()),
      onError: (err) => setErrors(apiFieldError(err)),
    });
  }
  return (
    <AuthLayout title={`Join ${i.production.name}`}>
      <p className="mb-4 text-sm text-ink-soft">
        You are invited as <strong>{i.role}</strong> in the <strong>{i.department}</strong> department, as {i.email}.
      </p>
      <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
        {!i.hasAccount && <TextField label="Your name" name="name" error={errors.name} autoFocus />}
        <TextField
          label={i.hasAccount ? 'Your existing password' : 'Choose a password'}
          name="password"
          type="password"
          autoComplete={i.hasAccount ? 'current-password' : 'new-password'}
          hint={i.hasAccount ? undefined : 'At least 10 characters.'}
          error={errors.password}
        />
        <ErrorMessage error={accept.error} />
        <Button type="submit" variant="primary" disabled={accept.isPending}>Accept and join</Button>
      </form>
    </AuthLayout>
  );
}
