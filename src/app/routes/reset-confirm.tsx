import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage, Notice } from '../../components/ui/alert';
import { useConfirmReset } from '../../features/auth/api/confirm-reset';
import { resetConfirmSchema } from '../../../shared/schemas/auth';
import { zodFieldErrors } from '../../lib/form-errors';

export default function ResetConfirmPage() {
  const { token = '' } = useParams();
  const confirm = useConfirmReset();
  const [errors, setErrors] = useState<Record<string, string>>({});
  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    if (fd.get('password') !== fd.get('repeat')) return setErrors({ repeat: 'the two passwords differ' });
    const parsed = resetConfirmSchema.safeParse({ token, password: fd.get('password') });
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    confirm.mutate(parsed.data);
  }
  return (
    <AuthLayout title="Choose a new password">
      {confirm.isSuccess ? (
        <Notice>Password changed for {confirm.data.email}. <Link to="/sign-in" className="text-accent underline">Sign in</Link></Notice>
      ) : (
        <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
          <TextField label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password} />
          <TextField label="Repeat it" name="repeat" type="password" autoComplete="new-password" error={errors.repeat} />
          <ErrorMessage error={errors.token ?? confirm.error} />
          <Button type="submit" variant="primary" disabled={confirm.isPending}>Set password</Button>
        </form>
      )}
    </AuthLayout>
  );
}
