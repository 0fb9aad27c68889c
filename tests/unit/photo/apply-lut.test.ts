import { describe, expect, it } from 'vitest';
import { buildExposureLut, lutNodeEncoded, sampleExposureLut } from '../../../shared/photo/exposure-lut';
import { applyLut16, applyLut8, planLut16, planLut8, STOPS_Q } from '../../../shared/photo/apply-lut';
import { greyOfStops, type ToneCurveTable } from '../../../shared/look/tone-curve-table';
import { random } from '../spectral/fixtures';

/**
 * Shared default tolerance, 16-bit output codes. The renderer carries stops in fixed point (1/STOPS_Q
 * stop) and the blue weight in 1/256 of a node step; with this test table (1.5 stops per node step,
 * grey 1/24 per stop) that is at most (1/2048 + 1.5/512) stop · 65535/24 ≈ 9.3 codes, plus rounding.
 */
const TOL_CODES = 10;
/** An affine function is reproduced exactly by trilinear interpolation (a property of the method). */
const EXACT = 1e-5;

/** A table whose stops are affine in the encoded values: −12 + 6r + 4g + 2b (stops). */
const affine = (r: number, g: number, b: number) => -12 + 6 * r + 4 * g + 2 * b;
const enc = (v: number) => v; // the test table's nodes are built from encoded values directly
const SIZE = 9;
const lut = buildExposureLut(SIZE, enc, affine);
/** A tone curve linear in stops: grey = (stops + 20) / 24, over −20..4 stops. */
const tone: ToneCurveTable = { minStops: -20, step: 1 / 64, grey: Float32Array.from({ length: 24 * 64 + 1 }, (_, i) => i / (24 * 64)), offsetStops: 0 };

describe('the 3-D table', () => {
  it('puts node i at the encoded value i / (size − 1)', () => {
    expect(lutNodeEncoded(0, 33)).toBe(0);
    expect(lutNodeEncoded(32, 33)).toBe(1);
    expect(lutNodeEncoded(16, 33)).toBe(0.5);
  });

  it('reproduces an affine function exactly between the nodes (trilinear)', () => {
    const rnd = random(7);
    for (let k = 0; k < 500; k++) {
      const [r, g, b] = [rnd(), rnd(), rnd()];
      expect(Math.abs(sampleExposureLut(lut, r, g, b) - affine(r, g, b))).toBeLessThan(EXACT);
    }
    expect(sampleExposureLut(lut, -1, 2, 0.5)).toBeCloseTo(affine(0, 1, 0.5), 5);
  });
});

describe('one pass over raw pixels', () => {
  const exact16 = (r: number, g: number, b: number) => Math.round(greyOfStops(tone, sampleExposureLut(lut, r, g, b)) * 65535);

  it('8-bit pixels, 16-bit output: the trilinear grey of each pixel', () => {
    const rnd = random(11);
    const n = 5000;
    const src = Uint8Array.from({ length: n * 4 }, () => Math.floor(rnd() * 256));
    const out = new Uint16Array(n);
    applyLut8(planLut8(lut, tone, 16), src, 4, out, 0, n);
    for (let j = 0; j < n; j++) {
      expect(Math.abs(out[j] - exact16(src[4 * j] / 255, src[4 * j + 1] / 255, src[4 * j + 2] / 255))).toBeLessThanOrEqual(TOL_CODES);
    }
  });

  it('16-bit pixels, 16-bit output, in chunks', () => {
    const rnd = random(12);
    const n = 5000;
    const src = Uint16Array.from({ length: n * 3 }, () => Math.floor(rnd() * 65536));
    const out = new Uint16Array(n);
    const plan = planLut16(lut, tone, 16);
    for (let from = 0; from < n; from += 777) applyLut16(plan, src, 3, out, from, Math.min(n, from + 777));
    for (let j = 0; j < n; j++) {
      expect(Math.abs(out[j] - exact16(src[3 * j] / 65535, src[3 * j + 1] / 65535, src[3 * j + 2] / 65535))).toBeLessThanOrEqual(TOL_CODES);
    }
  });

  it('8-bit output is the 16-bit result to 8 bits', () => {
    const src = Uint8Array.from([0, 0, 0, 255, 255, 255, 128, 64, 200]);
    const o8 = new Uint8Array(3);
    const o16 = new Uint16Array(3);
    applyLut8(planLut8(lut, tone, 8), src, 3, o8, 0, 3);
    applyLut8(planLut8(lut, tone, 16), src, 3, o16, 0, 3);
    for (let j = 0; j < 3; j++) expect(Math.abs(o8[j] - o16[j] / 257)).toBeLessThanOrEqual(0.5 + TOL_CODES / 257);
    expect(STOPS_Q).toBe(2048);
  });
});
