/**
 * POST /api/simulate's computation as a compute-pool job (services/compute-jobs.ts): the engine's
 * `simulate` on the validated body. Loaded in the pool's threads: engine imports only.
 */
import type { SimulateRequest } from '../../../shared/schemas/simulate';
import { simulate, type SimulationResult } from '../../../shared/spectral/compute';
import { computeJob } from '../../services/compute-jobs';

export const simulateJob = computeJob<SimulateRequest, SimulationResult>('simulate', import.meta.url, (body, table) => simulate(body, table));
