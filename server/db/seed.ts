import type { AppContext } from '../context';
import { User } from './entities/user.entity';
import { Production } from './entities/production.entity';
import { Membership } from './entities/membership.entity';
import { hashPassword } from '../modules/auth/password';
import type { Department, Role } from '../../shared/schemas/roles';
// DEMO SEED IMPORTS START
import { seedLooksAndBoards } from './seed-content/looks-boards';
import { seedDemoPhotos } from './seed-content/photos';
// DEMO SEED IMPORTS END

/** Every demo account uses this password (invented demo data). */
export const DEMO_PASSWORD = 'grisaille-demo';
export const DEMO_PRODUCTION_NAME = "The Clockmaker's Winter";

interface DemoAccount {
  email: string;
  name: string;
  role: Role | null;
  department: Department | null;
  isAdmin?: boolean;
  note: string;
}

/** Invented people for an invented production: a 1930s period piece set in a mountain clock workshop. */
export const DEMO_ACCOUNTS: DemoAccount[] = [
  { email: 'admin@demo.grisaille.test', name: 'Site admin', role: null, department: null, isAdmin: true, note: 'site admin (outbox), not a member' },
  { email: 'camera@demo.grisaille.test', name: 'Cinematographer', role: 'owner', department: 'camera', note: 'owner · camera (the cinematographer)' },
  { email: 'assistant@demo.grisaille.test', name: 'Camera assistant', role: 'editor', department: 'camera', note: 'editor · camera' },
  { email: 'gaffer@demo.grisaille.test', name: 'Gaffer', role: 'editor', department: 'lighting', note: 'editor · lighting' },
  { email: 'makeup@demo.grisaille.test', name: 'Makeup designer', role: 'contributor', department: 'makeup', note: 'contributor · makeup' },
  { email: 'costume@demo.grisaille.test', name: 'Costume designer', role: 'contributor', department: 'costume', note: 'contributor · costume' },
  { email: 'art@demo.grisaille.test', name: 'Set painter', role: 'contributor', department: 'art', note: 'contributor · art' },
  { email: 'producer@demo.grisaille.test', name: 'Producer', role: 'viewer', department: 'production', note: 'viewer · production' },
  { email: 'lab@demo.grisaille.test', name: 'Lab contact', role: 'viewer', department: 'lab', note: 'viewer · lab' },
];

/**
 * Seeds the demo production when the database has no users yet (first run). Everything is invented.
 * Returns true when it seeded. Runs in one transaction: all or nothing.
 */
export async function seedDemo(ctx: AppContext): Promise<boolean> {
  if ((await ctx.ds.getRepository(User).count()) > 0) return false;
  const hash = await hashPassword(DEMO_PASSWORD);
  await ctx.ds.transaction(async (t) => {
    const production = await t.save(Production, {
      name: DEMO_PRODUCTION_NAME,
      description:
        'Invented demo production. A 1930s period piece shot on black-and-white negative: a clockmaker, his workshop ' +
        'of brass and lacquer, a winter village. Every person, look, swatch and photo here is made up.',
      isDemo: true,
    });
    const members: Record<string, Membership> = {};
    for (const a of DEMO_ACCOUNTS) {
      const user = await t.save(User, { email: a.email, name: a.name, passwordHash: hash, isAdmin: !!a.isAdmin });
      if (a.role && a.department) members[a.email] = await t.save(Membership, { user, production, role: a.role, department: a.department });
    }
    // DEMO SEED CALLS START
    await seedLooksAndBoards(t, production, members, ctx.env.dataDir);
    await seedDemoPhotos(t, production, members, ctx.env.dataDir);
    // DEMO SEED CALLS END
  });
  return true;
}
