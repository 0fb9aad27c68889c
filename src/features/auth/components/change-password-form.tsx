import type { FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { ErrorMessage, Notice } from '../../../components/ui/alert';
import { changePasswordSchema } from '../../../../shared/schemas/auth';
import { useFormCheck } from '../../../lib/use-form-check';
import { useChangePassword } from '../api/change-password';

/** Current password, new one twice; on success the server has signed out every other session. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const { errors, setErrors, check, fromServer } = useFormCheck();

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const fd = new FormData(form);
    if (fd.get('newPassword') !== fd.get('repeat')) return setErrors({ repeat: 'the two new passwords differ' });
    const input = check(changePasswordSchema, { currentPassword: fd.get('currentPassword'), newPassword: fd.get('newPassword') });
    if (!input) return;
    change.mutate(input, { onSuccess: () => form.reset(), onError: fromServer });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <TextField label="Current password" name="currentPassword" type="password" autoComplete="current-password" error={errors.currentPassword} />
      <TextField label="New password" name="newPassword" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.newPassword} />
      <TextField label="Repeat the new password" name="repeat" type="password" autoComplete="new-password" error={errors.repeat} />
      <ErrorMessage error={!Object.keys(errors).length && change.error} />
      {change.isSuccess && <Notice>Password changed. Every other session was signed out; this one stays signed in.</Notice>}
      <Button type="submit" variant="primary" disabled={change.isPending} className="self-start">Change password</Button>
    </form>
  );
}
