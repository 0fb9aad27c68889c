import type { Membership } from '../../db/entities/membership.entity';
import type { Department } from '../../../shared/schemas/roles';
import { roleAtLeast } from '../../../shared/schemas/roles';
import { ForbiddenError } from '../../errors';

/**
 * Who may change a department's swatches and boards: editors and owners any department's; contributors
 * only their own. (Routes have already required at least the contributor role.)
 */
export function assertDepartmentAccess(m: Membership, department: Department, what: string): void {
  if (roleAtLeast(m.role, 'editor')) return;
  if (m.role === 'contributor' && m.department === department) return;
  throw new ForbiddenError(`Contributors change ${what} of their own department (${m.department}) only; this belongs to ${department}.`);
}
