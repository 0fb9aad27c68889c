import type { FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { AuthForm } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage, Notice } from '../../components/ui/alert';
import { useConfirmReset } from '../../features/auth/api/confirm-reset';
import { resetConfirmSchema } from '../../../shared/schemas/auth';
import { useFormCheck } from '../../lib/use-form-check';
import { paths } from '../../lib/paths';

export default function ResetConfirmPage() {
  const { token = '' } = useParams();
  const confirm = useConfirmReset();
  const { errors, setErrors, check } = useFormCheck();
  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    if (fd.get('password') !== fd.get('repeat')) return setErrors({ repeat: 'the two passwords differ' });
    const input = check(resetConfirmSchema, { token, password: fd.get('password') });
    if (input) confirm.mutate(input);
  }
  return (
    <AuthForm title="Choose a new password" onSubmit={submit}
      done={confirm.isSuccess && <Notice>Password changed for {confirm.data.email}. <Link to={paths.signIn()} className="text-accent underline">Sign in</Link></Notice>}>
      <TextField label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password} />
      <TextField label="Repeat it" name="repeat" type="password" autoComplete="new-password" error={errors.repeat} />
      <ErrorMessage error={errors.token ?? confirm.error} />
      <Button type="submit" variant="primary" disabled={confirm.isPending}>Set password</Button>
    </AuthForm>
  );
}
