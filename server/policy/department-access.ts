import type { Membership } from '../db/entities/membership.entity';
import type { Department } from '../../shared/schemas/roles';
import { departmentRefusal, mayChangeDepartmentItem } from '../../shared/policy/department';
import { ForbiddenError } from '../errors';

/**
 * Refuses unless `m` may change an item of `department` (shared/policy/department.ts: editors and owners
 * any department's; contributors only their own). Routes have already required the contributor role.
 */
export function assertDepartmentAccess(m: Membership, department: Department, what: string): void {
  if (!mayChangeDepartmentItem(m, department)) throw new ForbiddenError(departmentRefusal(m, department, what));
}
