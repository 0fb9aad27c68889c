import type { ExposureRequest, ExposureResponse, EiChainStepAnswer } from '../../../shared/schemas/exposure';
import { eiChain, formatStops, type EiStepName } from '../../../shared/tone/ei-chain';
import { DEFAULT_INCIDENT_C, DEFAULT_INCIDENT_C_NOTE, describeLightCost, lightCost, lightLevel } from '../../../shared/tone/light-level';

const LABELS: Record<EiStepName, string> = {
  box: 'Box speed',
  rating: 'Development / rating',
  filter: 'Filter factor',
};

/**
 * POST /api/exposure: the exposure-index chain and/or the incident light level (ISO 2720) at the
 * given EI or at the chain's effective EI. Input is already checked by exposureRequestSchema.
 */
export function computeExposure(req: ExposureRequest): ExposureResponse {
  const out: ExposureResponse = {};
  let chainEI: number | undefined;
  let unfilteredEI: number | undefined;
  if (req.boxSpeed !== undefined) {
    const chain = eiChain({ boxSpeed: req.boxSpeed, ratingStops: req.ratingStops, filterStops: req.filterStops });
    const steps: EiChainStepAnswer[] = chain.steps.map((s) => ({ ...s, label: LABELS[s.step], stopsLabel: formatStops(s.stops) }));
    Object.assign(out, {
      boxSpeed: req.boxSpeed,
      steps,
      totalStops: chain.totalStops,
      unfilteredEI: chain.unfilteredEI,
      effectiveEI: chain.effectiveEI,
    });
    chainEI = chain.effectiveEI;
    unfilteredEI = chain.unfilteredEI;
  }
  if (req.tStop !== undefined && req.fps !== undefined && req.shutterAngle !== undefined) {
    const ei = chainEI ?? req.ei!;
    const c = req.calibrationConstant ?? DEFAULT_INCIDENT_C;
    const level = lightLevel({ ei, tStop: req.tStop, fps: req.fps, shutterAngle: req.shutterAngle, calibrationConstant: c });
    Object.assign(out, {
      ei,
      eiSource: chainEI !== undefined ? 'chain' : 'request',
      tStop: req.tStop,
      fps: req.fps,
      shutterAngle: req.shutterAngle,
      exposureSeconds: level.exposureSeconds,
      calibrationConstant: level.calibrationConstant,
      calibrationNote: req.calibrationConstant === undefined ? DEFAULT_INCIDENT_C_NOTE : `incident-light constant C = ${c} as given (E in lux)`,
      lux: level.lux,
      footcandles: level.footcandles,
    });
    if (chainEI !== undefined && unfilteredEI !== undefined) {
      const cost = lightCost(chainEI, unfilteredEI);
      out.lightCost = { referenceEI: unfilteredEI, ratio: cost.ratio, stops: cost.stops, text: describeLightCost(cost.ratio) };
    }
  }
  return out;
}
