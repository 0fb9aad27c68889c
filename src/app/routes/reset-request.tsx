import type { FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { AuthForm } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage, Notice } from '../../components/ui/alert';
import { useRequestReset } from '../../features/auth/api/request-reset';
import { resetRequestSchema } from '../../../shared/schemas/auth';
import { useFormCheck } from '../../lib/use-form-check';
import { paths } from '../../lib/paths';

export default function ResetRequestPage() {
  const req = useRequestReset();
  const { errors, check } = useFormCheck();
  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const input = check(resetRequestSchema, { email: new FormData(e.currentTarget).get('email') });
    if (input) req.mutate(input);
  }
  return (
    <AuthForm title="Reset your password" onSubmit={submit}
      done={req.isSuccess && <Notice>{req.data.message} The link works for one hour.</Notice>}
      after={<Link to={paths.signIn()} className="mt-4 inline-block text-sm text-accent underline">Back to sign-in</Link>}>
      <TextField label="E-mail" name="email" type="email" error={errors.email} autoFocus />
      <ErrorMessage error={req.error} />
      <Button type="submit" variant="primary" disabled={req.isPending}>Send reset link</Button>
    </AuthForm>
  );
}
