import type { Department, Role } from '../../../../shared/schemas/roles';

export interface ProductionSummary {
  id: number;
  name: string;
  description: string;
  isDemo: boolean;
  createdAt: string;
  myRole: Role;
  myDepartment: Department;
  memberCount?: number;
}
