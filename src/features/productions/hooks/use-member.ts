import { useMemo } from 'react';
import type { MemberLike } from '../../../../shared/policy/department';
import type { ProductionSummary } from '../api/types';
import { useProduction } from '../api/get-production';

/** The signed-in user as a member of a production, in the shape the shared policy takes. */
export function memberOf(p: Pick<ProductionSummary, 'myRole' | 'myDepartment'> | undefined): MemberLike | null {
  return p ? { role: p.myRole, department: p.myDepartment } : null;
}

/** The production and the signed-in user's membership of it (null while loading). */
export function useMember(pid: number) {
  const production = useProduction(pid);
  const p = production.data?.production;
  const member = useMemo(() => memberOf(p), [p]);
  return { production, member };
}
