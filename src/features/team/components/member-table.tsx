import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { DEPARTMENTS, ROLES, type Department, type Role } from '../../../../shared/schemas/roles';
import type { Member } from '../api/types';

/** One of a member's settings: a small select for the owner, plain text for everyone else. */
function MemberChoice<T extends string>({ editable, label, value, options, onChange }: { editable: boolean; label: string; value: T; options: readonly T[]; onChange: (v: T) => void }) {
  if (!editable) return <>{value}</>;
  return (
    <select aria-label={label} className="rounded border border-paper-line bg-paper-raised px-1 py-0.5" value={value} onChange={(e) => onChange(e.target.value as T)}>
      {options.map((o) => <option key={o}>{o}</option>)}
    </select>
  );
}

/** The production's members; the owner changes their department and role, or removes them. */
export function MemberTable({ members, isOwner, onChange, onRemove }: {
  members: Member[];
  isOwner: boolean;
  onChange: (id: number, change: { department?: Department; role?: Role }) => void;
  onRemove: (m: Member) => void;
}) {
  return (
    <Card className="mb-6 overflow-x-auto p-0">
      <table className="w-full text-sm">
        <caption className="sr-only">Members</caption>
        <thead className="border-b border-paper-line text-left text-xs uppercase tracking-wide text-ink-mute">
          <tr><th className="px-4 py-2">Name</th><th className="px-4 py-2">E-mail</th><th className="px-4 py-2">Department</th><th className="px-4 py-2">Role</th>{isOwner && <th className="px-4 py-2"><span className="sr-only">Actions</span></th>}</tr>
        </thead>
        <tbody>
          {members.map((m) => (
            <tr key={m.id} className="border-b border-paper-line last:border-0">
              <td className="px-4 py-2 font-medium">{m.user.name}</td>
              <td className="px-4 py-2 text-ink-soft">{m.user.email}</td>
              <td className="px-4 py-2">
                <MemberChoice editable={isOwner} label={`Department of ${m.user.name}`} value={m.department} options={DEPARTMENTS} onChange={(department) => onChange(m.id, { department })} />
              </td>
              <td className="px-4 py-2">
                <MemberChoice editable={isOwner} label={`Role of ${m.user.name}`} value={m.role} options={ROLES} onChange={(role) => onChange(m.id, { role })} />
              </td>
              {isOwner && (
                <td className="px-4 py-2 text-right">
                  <Button variant="ghost" onClick={() => confirm(`Remove ${m.user.name} from this production?`) && onRemove(m)}>Remove</Button>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
