import type { EntityManager, EntityTarget, FindOptionsRelations, FindOptionsWhere, ObjectLiteral } from 'typeorm';
import { NotFoundError } from '../errors';

/**
 * The row `id` of `entity` that belongs to production `productionId`, or NotFoundError(`what`) (a 404):
 * an id from another production is answered exactly like one that does not exist.
 */
export async function findInProduction<T extends ObjectLiteral>(
  em: EntityManager,
  entity: EntityTarget<T>,
  productionId: number,
  id: number,
  what: string,
  relations?: FindOptionsRelations<T>,
): Promise<T> {
  const where = { id, production: { id: productionId } } as unknown as FindOptionsWhere<T>;
  const row = await em.findOne(entity, { where, relations });
  if (!row) throw new NotFoundError(what);
  return row;
}
