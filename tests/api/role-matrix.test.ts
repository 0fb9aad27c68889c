/**
 * Every production route × every role, and no session, and a signed-in non-member.
 * The routes come from the registry that productionRoute() fills, so a new route cannot be left out.
 * Expected: no session → 401; non-member → 404 (existence not revealed); below the route's role → 403;
 * at or above it → past the role check (GET list routes → 200).
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import { productionRoutes, type ProductionRoute } from '../../server/modules/route-registry';
import { Membership } from '../../server/db/entities/membership.entity';
import { Production } from '../../server/db/entities/production.entity';
import { User } from '../../server/db/entities/user.entity';
import { ROLES, type Role } from '../../shared/schemas/roles';
import { roleAtLeast } from '../../shared/policy/department';

let t: TestApp;
let pid: number;
const agents: Record<string, Agent> = {};
/** department of each acting member: the contributor is in makeup */
const ACTORS: { key: Role; email: string; department: 'camera' | 'makeup' | 'production' }[] = [
  { key: 'owner', email: 'camera@demo.grisaille.test', department: 'camera' },
  { key: 'editor', email: 'assistant@demo.grisaille.test', department: 'camera' },
  { key: 'contributor', email: 'makeup@demo.grisaille.test', department: 'makeup' },
  { key: 'viewer', email: 'producer@demo.grisaille.test', department: 'production' },
];

beforeAll(async () => {
  t = await startTestApp();
  // a scratch production, so allowed calls (even deletes) never touch the demo one
  const ds = t.ctx.ds;
  const p = await ds.getRepository(Production).save({ name: 'Role matrix scratch', description: '' });
  pid = p.id;
  for (const a of ACTORS) {
    const user = await ds.getRepository(User).findOneByOrFail({ email: a.email });
    await ds.getRepository(Membership).save({ user, production: p, role: a.key, department: a.department });
    agents[a.key] = await t.agent(a.email);
  }
  agents.none = await t.agent();
  agents.outsider = await t.agent('admin@demo.grisaille.test'); // signed in, site admin, not a member
});
afterAll(async () => t?.close());

function url(r: ProductionRoute): string {
  return r.path.replace(':productionId', String(pid)).replace(/:[A-Za-z]+/g, '999999');
}
function call(a: Agent, r: ProductionRoute) {
  const u = url(r);
  const req = r.method === 'get' ? a.get(u) : r.method === 'delete' ? a.delete(u) : a[r.method](u).send({});
  return req;
}
const roleDenied = (body: { error?: { message?: string } }) => /^This needs the/.test(body?.error?.message ?? '');
const productionHidden = (body: { error?: { message?: string } }) => body?.error?.message === 'Production was not found.';

it('has the routes of the foundation in its registry', () => {
  const paths = productionRoutes.map((r) => `${r.method} ${r.path}`);
  for (const p of ['get /api/productions/:productionId', 'get /api/productions/:productionId/members', 'post /api/productions/:productionId/invitations'])
    expect(paths).toContain(p);
});

it('answers every production route right for every role, no session and non-members', async () => {
  const routes = [...productionRoutes].sort((a, b) => Number(a.method === 'delete' && a.path.endsWith(':productionId')) - Number(b.method === 'delete' && b.path.endsWith(':productionId')));
  const failures: string[] = [];
  for (const r of routes) {
    const label = `${r.method.toUpperCase()} ${r.path} (needs ${r.role})`;
    const none = await call(agents.none, r);
    if (none.status !== 401) failures.push(`${label}: no session → ${none.status}, expected 401`);
    const out = await call(agents.outsider, r);
    if (out.status !== 404 || !productionHidden(out.body)) failures.push(`${label}: non-member → ${out.status}, expected 404`);
    for (const role of ROLES) { // weakest first, so an allowed delete of the production comes last
      const res = await call(agents[role], r);
      if (roleAtLeast(role, r.role)) {
        if (res.status === 401 || (res.status === 403 && roleDenied(res.body)) || productionHidden(res.body))
          failures.push(`${label}: ${role} → ${res.status} ${JSON.stringify(res.body)}, expected to pass the role check`);
        // a list (no path parameter after the production) must answer 200; an item of an unknown id or key may 404
        if (r.method === 'get' && !/:[A-Za-z]+/.test(r.path.replace(':productionId', '')) && res.status !== 200 && !r.path.includes('.'))
          failures.push(`${label}: ${role} → ${res.status}, expected 200`);
      } else if (res.status !== 403 || !roleDenied(res.body)) failures.push(`${label}: ${role} → ${res.status}, expected 403`);
    }
  }
  expect(failures).toEqual([]);
  expect(productionRoutes.length).toBeGreaterThanOrEqual(9);
});
