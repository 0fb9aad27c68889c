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
import { DEPARTMENTS, ROLES } from '../../../shared/schemas/roles';
import { MemberTable } from '../../features/team/components/member-table';
import { invitationCreateSchema } from '../../../shared/schemas/auth';
import { useFormCheck } from '../../lib/use-form-check';

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
  const { errors, check, fromServer } = useFormCheck();
  const [sent, setSent] = useState<string | null>(null);

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const input = check(invitationCreateSchema, Object.fromEntries(new FormData(form)));
    if (!input) return;
    invite.mutate({ pid, ...input }, {
      onSuccess: (r) => {
        setSent(r.invitation.email);
        form.reset();
      },
      onError: fromServer,
    });
  }

  return (
    <>
      <PageHeader title="Team" subtitle="Roles: viewers read; contributors edit their own department's swatches and boards; editors also edit looks and the library; owners manage the team." />
      {members.isPending && <Spinner />}
      <ErrorMessage error={members.error ?? update.error ?? remove.error} />
      <MemberTable members={members.data?.members ?? []} isOwner={isOwner} onChange={(id, change) => update.mutate({ pid, id, ...change })} onRemove={(m) => remove.mutate({ pid, id: m.id })} />

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
