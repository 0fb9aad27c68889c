import type { DataSource } from 'typeorm';
import { Production } from '../../db/entities/production.entity';
import { Membership } from '../../db/entities/membership.entity';
import { Photo } from '../../db/entities/photo.entity';
import { removePhotoFiles } from '../photos/photo-storage';
import type { User } from '../../db/entities/user.entity';
import { NotFoundError } from '../../errors';
import type { ProductionCreateInput } from '../../../shared/schemas/auth';
import type { Department } from '../../../shared/schemas/roles';

export function productionView(p: Production, m?: Membership) {
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    isDemo: p.isDemo,
    createdAt: p.createdAt,
    ...(m ? { myRole: m.role, myDepartment: m.department } : {}),
  };
}

export class ProductionsService {
  /** `dataDir`: where photo files live (their production's deletion removes them). */
  constructor(
    private ds: DataSource,
    private dataDir?: string,
  ) {}

  async listFor(user: User) {
    const ms = await this.ds.getRepository(Membership).find({
      where: { user: { id: user.id } },
      relations: { production: true },
      order: { production: { name: 'ASC' } },
    });
    return ms.map((m) => productionView(m.production, m));
  }

  /** The creator becomes its owner. */
  async create(user: User, input: ProductionCreateInput, department: Department = 'camera') {
    return this.ds.transaction(async (t) => {
      const p = await t.save(Production, { name: input.name, description: input.description ?? '' });
      const m = await t.save(Membership, { user, production: p, role: 'owner', department });
      return productionView(p, m);
    });
  }

  async overview(m: Membership) {
    const members = await this.ds.getRepository(Membership).count({ where: { production: { id: m.production.id } } });
    return { ...productionView(m.production, m), memberCount: members };
  }

  async update(m: Membership, input: Partial<ProductionCreateInput>) {
    const repo = this.ds.getRepository(Production);
    const p = await repo.findOneBy({ id: m.production.id });
    if (!p) throw new NotFoundError('Production');
    Object.assign(p, Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)));
    return productionView(await repo.save(p), m);
  }

  /** Deletes the production (its rows cascade), then, once that has committed, its photos' files. */
  async remove(m: Membership) {
    const keys = await this.ds.transaction(async (t) => {
      const photos = await t.find(Photo, { where: { production: { id: m.production.id } }, select: { id: true, storageKey: true } });
      await t.delete(Production, { id: m.production.id });
      return photos.map((p) => p.storageKey);
    });
    if (this.dataDir) removePhotoFiles(this.dataDir, keys);
  }
}
