import type { Department, Role } from '../../../../shared/schemas/roles';

export interface Member {
  id: number;
  role: Role;
  department: Department;
  user: { id: number; name: string; email: string };
  createdAt: string;
}
export interface Invitation {
  id: number;
  email: string;
  role: Role;
  department: Department;
  expiresAt: string;
  acceptedAt: string | null;
  createdAt: string;
}
