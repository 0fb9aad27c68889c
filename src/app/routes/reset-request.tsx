import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { AuthLayout } from '../../components/layouts/auth-layout';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { ErrorMessage, Notice } from '../../components/ui/alert';
import { useRequestReset } from '../../features/auth/api/request-reset';
import { resetRequestSchema } from '../../../shared/schemas/auth';
import { zodFieldErrors } from '../../lib/form-errors';

export default function ResetRequestPage() {
  const req = useRequestReset();
  const [errors, setErrors] = useState<Record<string, string>>({});
  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = resetRequestSchema.safeParse({ email: new FormData(e.currentTarget).get('email') });
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    req.mutate(parsed.data);
  }
  return (
    <AuthLayout title="Reset your password">
      {req.isSuccess ? (
        <Notice>{req.data.message} The link works for one hour.</Notice>
      ) : (
        <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
          <TextField label="E-mail" name="email" type="email" error={errors.email} autoFocus />
          <ErrorMessage error={req.error} />
          <Button type="submit" variant="primary" disabled={req.isPending}>Send reset link</Button>
        </form>
      )}
      <Link to="/sign-in" className="mt-4 inline-block text-sm text-accent underline">Back to sign-in</Link>
    </AuthLayout>
  );
}
