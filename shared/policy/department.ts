/**
 * Who may change what, per production: the role order and the department rule, written once and used
 * by the server (which decides) and the client (which only hides what a role may not do).
 *
 * - viewer: reads;
 * - contributor: also adds and changes the swatches, boards and photos of their own department;
 * - editor: also any department's items, looks and the production's library;
 * - owner: also the team.
 */
import { ROLES, type Department, type Role } from '../schemas/roles';

/** true when `have` is at least `need` in the order viewer < contributor < editor < owner */
export function roleAtLeast(have: Role, need: Role): boolean {
  return ROLES.indexOf(have) >= ROLES.indexOf(need);
}

/** A member as the policy needs it: their role and department in one production. */
export interface MemberLike {
  role: Role;
  department: Department;
}

/** true when `member` may change an item (swatch, board, photo) that belongs to `department`. */
export function mayChangeDepartmentItem(member: MemberLike | null | undefined, department: Department): boolean {
  if (!member) return false;
  if (roleAtLeast(member.role, 'editor')) return true;
  return member.role === 'contributor' && member.department === department;
}

/** true when `member` may add items at all (contributors and up; a contributor's go to their own department). */
export function mayAddItems(member: MemberLike | null | undefined): boolean {
  return !!member && roleAtLeast(member.role, 'contributor');
}

/** The refusal the server gives when `mayChangeDepartmentItem` is false. */
export function departmentRefusal(member: MemberLike, department: Department, what: string): string {
  return `Contributors change ${what} of their own department (${member.department}) only; this belongs to ${department}.`;
}
