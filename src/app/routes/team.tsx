import { useState, type FormEvent } from 'react';
import { useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { SelectField, TextField } from '../../components/ui/field';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useProduction } from '../../features/productions/api/get-production';
import { useMembers } from '../../features/team/api/get-members';
import { useUpdateMember } from '../../features/team/api/update-member';
import { useRemoveMember } from '../../features/team/api/remove-member';
import { useInvitations } from '../../features/team/api/get-invitations';
import { useCreateInvitation } from '../../features/team/api/create-invitation';
import { useRevokeInvitation } from '../../features/team/api/revoke-invitation';
import { DEPARTMENTS, ROLES, type Department, type Role } from '../../../shared/schemas/roles';
import { invitationCreateSchema } from '../../../shared/schemas/auth';
import { apiFieldError, zodFieldErrors } from '../../lib/form-errors';

export default function TeamPage() {
  const pid = Number(useParams().productionId);
  const prod = useProduction(pid);
  const isOwner = prod.data?.production.myRole === 'owner';
  const members = useMembers(pid);
  const invitations = useInvitations(pid, isOwner);
  const update = useUpdateMember(pid);
  const remove = useRemoveMember(pid);
  const invite = useCreateInvitation(pid);
  const revoke = useRevokeInvitation(pid);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [sent, setSent] = useState<string | null>(null);

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const parsed = invitationCreateSchema.safeParse(Object.fromEntries(new FormData(form)));
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    invite.mutate({ pid, ...parsed.data }, {
      onSuccess: (r) => {
        setSent(r.invitation.email);
        form.reset();
      },
      onError: (err) => setErrors(apiFieldError(err)),
    });
  }

  return (
    <>
      <PageHeader title="Team" subtitle="Roles: viewers read; contributors edit their own department's swatches and boards; editors also edit looks and the library; owners manage the team." />
      {members.isPending && <Spinner />}
      <ErrorMessage error={members.error ?? update.error ?? remove.error} />
      <Card className="mb-6 overflow-x-auto p-0">
        <table className="w-full text-sm">
          <caption className="sr-only">Members</caption>
          <thead className="border-b border-paper-line text-left text-xs uppercase tracking-wide text-ink-mute">
            <tr><th className="px-4 py-2">Name</th><th className="px-4 py-2">E-mail</th><th className="px-4 py-2">Department</th><th className="px-4 py-2">Role</th>{isOwner && <th className="px-4 py-2"><span className="sr-only">Actions</span></th>}</tr>
          </thead>
          <tbody>
            {members.data?.members.map((m) => (
              <tr key={m.id} className="border-b border-paper-line last:border-0">
                <td className="px-4 py-2 font-medium">{m.user.name}</td>
                <td className="px-4 py-2 text-ink-soft">{m.user.email}</td>
                <td className="px-4 py-2">
                  {isOwner ? (
                    <select aria-label={`Department of ${m.user.name}`} className="rounded border border-paper-line bg-paper-raised px-1 py-0.5" value={m.department}
                      onChange={(e) => update.mutate({ pid, id: m.id, department: e.target.value as Department })}>
                      {DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}
                    </select>
                  ) : m.department}
                </td>
                <td className="px-4 py-2">
                  {isOwner ? (
                    <select aria-label={`Role of ${m.user.name}`} className="rounded border border-paper-line bg-paper-raised px-1 py-0.5" value={m.role}
                      onChange={(e) => update.mutate({ pid, id: m.id, role: e.target.value as Role })}>
                      {ROLES.map((r) => <option key={r}>{r}</option>)}
                    </select>
                  ) : m.role}
                </td>
                {isOwner && (
                  <td className="px-4 py-2 text-right">
                    <Button variant="ghost" onClick={() => confirm(`Remove ${m.user.name} from this production?`) && remove.mutate({ pid, id: m.id })}>Remove</Button>
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </Card>

      {isOwner && (
        <div className="grid gap-6 lg:grid-cols-2">
          <Card>
            <h2 className="mb-3">Invite someone</h2>
            <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate>
              <div className="sm:col-span-2"><TextField label="E-mail" name="email" type="email" error={errors.email} /></div>
              <SelectField label="Role" name="role" defaultValue="contributor" error={errors.role}>{ROLES.map((r) => <option key={r}>{r}</option>)}</SelectField>
              <SelectField label="Department" name="department" defaultValue="makeup" error={errors.department}>{DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}</SelectField>
              <div className="sm:col-span-2 flex flex-col gap-2">
                <ErrorMessage error={!Object.keys(errors).length && invite.error} />
                {sent && <Notice>Invitation sent to {sent}. The link works once, for 7 days.</Notice>}
                <Button type="submit" variant="primary" disabled={invite.isPending} className="self-start">Send invitation</Button>
              </div>
            </form>
          </Card>
          <Card>
            <h2 className="mb-3">Invitations</h2>
            {invitations.data?.invitations.length === 0 && <p className="text-sm text-ink-mute">None yet.</p>}
            <ul className="divide-y divide-paper-line text-sm">
              {invitations.data?.invitations.map((i) => (
                <li key={i.id} className="flex items-center justify-between gap-2 py-2">
                  <span>{i.email} <span className="text-ink-mute">· {i.role} · {i.department}</span></span>
                  {i.acceptedAt ? <span className="text-xs text-ink-mute">accepted</span> : new Date(i.expiresAt) < new Date() ? <span className="text-xs text-warn">expired</span> : (
                    <Button variant="ghost" onClick={() => revoke.mutate({ pid, id: i.id })}>Revoke</Button>
                  )}
                </li>
              ))}
            </ul>
          </Card>
        </div>
      )}
    </>
  );
}
