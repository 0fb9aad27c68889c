/**
 * The engine's 1 nm integration (issue 11, "spectral fidelity") against an independent 1 nm integration
 * written in numpy (Debian python3-numpy 1.24) and run inside the test:
 *
 * - the observer: colord's CIE 1931 2° table at 5 nm (Debian colord-data, /usr/share/colord/cmf/
 *   CIE1931-2deg-XYZ.cmf, 360–830 nm) interpolated to 1 nm by Sprague's fifth-order formula written out in
 *   the Python below from CIE 167:2005 (its interval coefficients and its two-point extrapolation at each
 *   end of the table) — the engine's own code (policy.ts `spragueAt`) is not used; SciPy's CubicSpline over
 *   the same table is computed beside it to show how much the choice of interpolation alone moves the answer;
 * - the illuminants: D65 from colord's own file (/usr/share/colord/illuminant/CIE-D65.sp, 5 nm) linearly
 *   interpolated to 1 nm (the CIE's 1 nm D65 is the linear interpolation of the 5 nm table), A from its
 *   defining formula (CIE 015:2018), lamps with lines exactly as the 1 nm data given to the engine;
 * - XYZ by plain summation at 1 nm over the observer's 360–830 nm (CIE 015:2018), k = 100 / Σ E·ȳ.
 *
 * Issue requirement: lights with narrow lines and surfaces with narrow bands agree within 0.1 in X, Y, Z.
 *
 * And the filter factor of a blackbody-lit infrared-sensitive stack against a numpy integration over the
 * whole 350–900 nm of the library models, evaluated in Python from data/library/*.json with the shapes of
 * media.ts, shapes.ts and filters.ts (Gaussian lobes by their FWHM; logistic edges 10 %→90 % over their
 * width; energy basis), lit by Planck's law at 3200 K with c2 = 1.4388e-2 m·K (CIE 015:2018): within 1 %.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { lightFromPairs, reflectanceFromPairs } from '../../../shared/spectral/bases';
import { filterFactor, resolveFilter, resolveMedium } from '../../../shared/spectral/compute';
import { whitePoint, xyzOfReflectance } from '../../../shared/spectral/integrate';
import { blackbody, cieIlluminant } from '../../../shared/spectral/lights';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { Xyz } from '../../../shared/spectral/types';

/** Default tolerance of this file: 0.1 in X, Y, Z on the Y = 100 scale (issue 11's requirement). */
const TOL_XYZ = 0.1;
/** Filter factors against the independent 350–900 nm integration: 1 % relative (issue 11's requirement). */
const TOL_FACTOR_REL = 0.01;
/**
 * CIE 1931 chromaticity of the 546.1 nm mercury line, x 0.2738, y 0.7174 (from memory; spectrum locus tables
 * of CIE 015): a light of that line alone has X/Y = x/y ≈ 0.38 and Z/Y = (1 − x − y)/y ≈ 0.012, so a white
 * point near X 38, Y 100, Z 1.2 — the check below that the engine does not return an equal-energy white.
 */
const HG_546_XY = [0.2738, 0.7174];
/** How close the pure-line white must come to the spectrum locus figure above (the line is at 546, not 546.1 nm). */
const TOL_LOCUS_XYZ = 1;

const ROOT = path.resolve(__dirname, '../../..');
const CMF_FILE = '/usr/share/colord/cmf/CIE1931-2deg-XYZ.cmf';
const D65_FILE = '/usr/share/colord/illuminant/CIE-D65.sp';

/** 1 nm wavelengths over the observer's range, the span the data below are given on. */
const NM_1 = Array.from({ length: 471 }, (_, i) => 360 + i);
const gauss = (nm: number, c: number, fwhm: number) => Math.exp(-0.5 * ((nm - c) / (fwhm / 2.3548200450309493)) ** 2);
const pairsOf = (f: (nm: number) => number): [number, number][] => NM_1.map((nm) => [nm, f(nm)]);

/** Single-nm lines of a metal-halide-like lamp, nm → relative power (a made-up generic pattern). */
const HALIDE_LINES: Record<number, number> = { 405: 0.3, 436: 0.6, 492: 0.2, 535: 0.7, 546: 1, 578: 0.5, 589: 0.9, 671: 0.4 };

/** Lamps with narrow lines, given at 1 nm (relative power). */
const LAMPS: { label: string; pairs: [number, number][] }[] = [
  { label: 'a 546 nm line alone', pairs: pairsOf((nm) => (nm === 546 ? 1 : 0)) },
  { label: 'a 546 nm line on a weak continuum (1 %)', pairs: pairsOf((nm) => (nm === 546 ? 1 : 0.01)) },
  {
    // tri-band: a blue line at 436 nm, green at 546 nm, a red line at 611 nm 3 nm wide, on a 2 % continuum
    label: 'tri-band lines 436, 546, 611 nm on a 2 % continuum',
    pairs: pairsOf((nm) => 0.02 + (nm === 436 ? 0.55 : 0) + (nm === 546 ? 1 : 0) + (nm === 611 ? 0.8 : Math.abs(nm - 611) === 1 ? 0.3 : 0)),
  },
  {
    // a metal-halide-like lamp: many single-nm lines over a broad continuum
    label: 'lines at 405, 436, 492, 535, 546, 578, 589, 671 nm on a broad continuum',
    pairs: pairsOf((nm) => 0.15 * gauss(nm, 560, 220) + (HALIDE_LINES[nm] ?? 0)),
  },
];

/** Surfaces, given at 1 nm (reflectance): broad ones and narrow bands, notches and a single-nm spike. */
const SURFACES: { label: string; pairs: [number, number][] }[] = [
  { label: 'grey 0.5', pairs: pairsOf(() => 0.5) },
  { label: 'red edge at 600 nm', pairs: pairsOf((nm) => 0.05 + 0.8 / (1 + Math.exp(-(nm - 600) / 8))) },
  { label: 'band 450 nm, 30 nm wide', pairs: pairsOf((nm) => 0.04 + 0.85 * gauss(nm, 450, 30)) },
  { label: 'band 545 nm, 10 nm wide', pairs: pairsOf((nm) => 0.03 + 0.9 * gauss(nm, 545, 10)) },
  { label: 'band 532 nm, 3 nm wide', pairs: pairsOf((nm) => 0.05 + 0.9 * gauss(nm, 532, 3)) },
  { label: 'band 587 nm, 5 nm wide', pairs: pairsOf((nm) => 0.05 + 0.9 * gauss(nm, 587, 5)) },
  { label: 'band 633 nm, 4 nm wide', pairs: pairsOf((nm) => 0.05 + 0.9 * gauss(nm, 633, 4)) },
  { label: 'band 455 nm, 5 nm wide', pairs: pairsOf((nm) => 0.05 + 0.9 * gauss(nm, 455, 5)) },
  { label: 'notch 611 nm, 2 nm wide', pairs: pairsOf((nm) => (Math.abs(nm - 611) <= 1 ? 0.1 : 0.8)) },
  { label: 'spike at 500 nm, 1 nm', pairs: pairsOf((nm) => (nm === 500 ? 0.9 : 0.1)) },
];

const XYZ_SCRIPT = String.raw`
import json, sys
import numpy as np
from scipy.interpolate import CubicSpline

def cgats(path):
    text = open(path).read()
    kw = {}
    for line in text.split("BEGIN_DATA_FORMAT")[0].splitlines():
        parts = line.split()
        if len(parts) == 2: kw[parts[0]] = parts[1].strip('"')
    rows = text.split("\nBEGIN_DATA\n")[1].split("END_DATA")[0].split("\n")
    data = np.array([[float(v) for v in r.split()] for r in rows if r.strip()])
    start, end, n = float(kw["SPECTRAL_START_NM"]), float(kw["SPECTRAL_END_NM"]), int(kw["SPECTRAL_BANDS"])
    assert data.shape[1] == n
    return start, (end - start) / (n - 1), data

def sprague(p, start, step, nm):
    # CIE 167:2005: two points extrapolated at each end, then a quintic per interval
    p = np.asarray(p, float)
    lo2 = (884*p[0] - 1960*p[1] + 3033*p[2] - 2648*p[3] + 1080*p[4] - 180*p[5]) / 209
    lo1 = (508*p[0] - 540*p[1] + 488*p[2] - 367*p[3] + 144*p[4] - 24*p[5]) / 209
    hi1 = (-24*p[-6] + 144*p[-5] - 367*p[-4] + 488*p[-3] - 540*p[-2] + 508*p[-1]) / 209
    hi2 = (-180*p[-6] + 1080*p[-5] - 2648*p[-4] + 3033*p[-3] - 1960*p[-2] + 884*p[-1]) / 209
    q = np.concatenate([[lo2, lo1], p, [hi1, hi2]])
    t = (np.asarray(nm, float) - start) / step
    i = np.clip(np.floor(t).astype(int), 0, len(p) - 2)
    x = t - i
    P = [q[i + k] for k in range(6)]  # P[0] = p[i-2] ... P[5] = p[i+3]
    a0 = P[2]
    a1 = (2*P[0] - 16*P[1] + 16*P[3] - 2*P[4]) / 24
    a2 = (-P[0] + 16*P[1] - 30*P[2] + 16*P[3] - P[4]) / 24
    a3 = (-9*P[0] + 39*P[1] - 70*P[2] + 66*P[3] - 33*P[4] + 7*P[5]) / 24
    a4 = (13*P[0] - 64*P[1] + 126*P[2] - 124*P[3] + 61*P[4] - 12*P[5]) / 24
    a5 = (-5*P[0] + 25*P[1] - 50*P[2] + 50*P[3] - 25*P[4] + 5*P[5]) / 24
    return a0 + x*(a1 + x*(a2 + x*(a3 + x*(a4 + x*a5))))

inp = json.load(sys.stdin)
nm = np.arange(360, 831, 1.0)
start, step, cmf5 = cgats(inp["cmf"])
assert (start, step) == (360.0, 5.0) and cmf5.shape == (3, 95)
nodes = start + step * np.arange(cmf5.shape[1])
obs = {"sprague": np.array([sprague(c, start, step, nm) for c in cmf5]),
       "cubic": np.array([CubicSpline(nodes, c)(nm) for c in cmf5])}
d_start, d_step, d65 = cgats(inp["d65"])
lights = {"D65": np.interp(nm, d_start + d_step * np.arange(d65.shape[1]), d65[0]),
          "A": (560 / nm)**5 * np.expm1(1.435e7 / (2848 * 560)) / np.expm1(1.435e7 / (2848 * nm))}
for l in inp["lamps"]:
    v = dict((round(a), b) for a, b in l["pairs"])
    lights[l["label"]] = np.array([v[int(x)] for x in nm])
surfaces = [np.array([dict((round(a), b) for a, b in s["pairs"])[int(x)] for x in nm]) for s in inp["surfaces"]]
out = {}
for name, e in lights.items():
    out[name] = {}
    for kind, c in obs.items():
        k = 100 / np.sum(e * c[1])
        out[name][kind] = {"white": list(k * (c @ e)), "xyz": [list(k * (c @ (e * s))) for s in surfaces]}
json.dump(out, sys.stdout)
`;

interface NumpyXyz {
  white: Xyz;
  xyz: Xyz[];
}
type NumpyAnswer = Record<string, { sprague: NumpyXyz; cubic: NumpyXyz }>;

let numpyAnswer: NumpyAnswer | null = null;
/** Every white and XYZ by the numpy integration, in one python3 process (run once, on first use). */
function numpyXyz(): NumpyAnswer {
  if (!numpyAnswer) {
    const input = { cmf: CMF_FILE, d65: D65_FILE, lamps: LAMPS, surfaces: SURFACES };
    const text = execFileSync('/usr/bin/python3', ['-c', XYZ_SCRIPT], { input: JSON.stringify(input), encoding: 'utf8', maxBuffer: 16 << 20 });
    numpyAnswer = JSON.parse(text) as NumpyAnswer;
  }
  return numpyAnswer;
}

const surfaces = SURFACES.map((s) => ({ label: s.label, s: reflectanceFromPairs(s.pairs) }));
const fmt = (v: readonly number[]) => v.map((x) => x.toFixed(3)).join(' / ');

/** Compares the engine's white and surface XYZ under `light` with numpy's; returns the largest differences. */
function compare(label: string, light: Spectrum, ref: { sprague: NumpyXyz; cubic: NumpyXyz }): { worst: number; cubic: number } {
  let worst = 0;
  let cubic = 0;
  const white = whitePoint(light);
  const rows: [string, Xyz, Xyz, Xyz][] = [['white', white, ref.sprague.white, ref.cubic.white]];
  expect(ref.sprague.xyz).toHaveLength(surfaces.length);
  surfaces.forEach(({ label: sl, s }, i) => rows.push([sl, xyzOfReflectance(s, light), ref.sprague.xyz[i], ref.cubic.xyz[i]]));
  for (const [what, ours, theirs, spline] of rows) {
    for (let c = 0; c < 3; c++) {
      expect(Math.abs(ours[c] - theirs[c]), `${label}, ${what} ${'XYZ'[c]}: engine ${ours[c]}, numpy ${theirs[c]}`).toBeLessThanOrEqual(TOL_XYZ);
      worst = Math.max(worst, Math.abs(ours[c] - theirs[c]));
      cubic = Math.max(cubic, Math.abs(ours[c] - spline[c]));
    }
  }
  console.info(`${label}: white engine ${fmt(white)}, numpy ${fmt(ref.sprague.white)}; largest XYZ difference ${worst.toFixed(4)} (against a cubic-spline observer ${cubic.toFixed(4)})`);
  return { worst, cubic };
}

describe('lights with narrow lines given at 1 nm: white point and XYZ against numpy at 1 nm (within 0.1)', () => {
  for (const lamp of LAMPS) {
    it(lamp.label, () => {
      compare(lamp.label, lightFromPairs(lamp.pairs), numpyXyz()[lamp.label]);
    });
  }
  it('a 546 nm line alone has the spectrum locus colour there (X ≈ 38, Z ≈ 1.2), not an equal-energy white', () => {
    const [x, y] = HG_546_XY;
    const w = whitePoint(lightFromPairs(LAMPS[0].pairs));
    expect(Math.abs(w[0] - (100 * x) / y)).toBeLessThanOrEqual(TOL_LOCUS_XYZ);
    expect(w[1]).toBeCloseTo(100, 9);
    expect(Math.abs(w[2] - (100 * (1 - x - y)) / y)).toBeLessThanOrEqual(TOL_LOCUS_XYZ);
  });
});

/** Lamps measured finer than the grid, at 0.1 nm (a sodium-like doublet; a line between two grid wavelengths). */
const FINE_LAMPS: { label: string; pairs: [number, number][] }[] = (() => {
  const nm = Array.from({ length: 4701 }, (_, i) => Math.round((360 + i / 10) * 10) / 10);
  const lamp = (f: (x: number) => number) => nm.map((x) => [x, f(x)] as [number, number]);
  return [
    { label: 'a doublet at 589.0 and 589.6 nm given at 0.1 nm', pairs: lamp((x) => (x === 589 ? 1 : x === 589.6 ? 0.5 : 0)) },
    { label: 'a line at 546.5 nm on a 1 % continuum given at 0.1 nm', pairs: lamp((x) => (x === 546.5 ? 1 : 0.01)) },
    { label: 'a 0.3 nm wide line at 611.2 nm on a broad continuum given at 0.1 nm', pairs: lamp((x) => 0.05 * gauss(x, 560, 200) + (Math.abs(x - 611.2) <= 0.15 ? 2 : 0)) },
  ];
})();

const FINE_SCRIPT = String.raw`
import json, sys
import numpy as np
exec(sys.argv[1])
inp = json.load(sys.stdin)
start, step, cmf5 = cgats(inp["cmf"])
out = {}
for l in inp["lamps"]:
    nm = np.array([a for a, b in l["pairs"]]); e = np.array([b for a, b in l["pairs"]])
    c = np.array([sprague(ch, start, step, nm) for ch in cmf5])
    c[:, (nm < 360) | (nm > 830)] = 0
    k = 100 / np.sum(e * c[1])
    out[l["label"]] = list(k * (c @ e))
json.dump(out, sys.stdout)
`;

describe('lights measured finer than the grid (0.1 nm): white point against numpy at 0.1 nm (within 0.1)', () => {
  // the engine band-integrates the data into its 1 nm grid (policy.ts); numpy integrates them as given
  const helpers = XYZ_SCRIPT.slice(XYZ_SCRIPT.indexOf('def cgats'), XYZ_SCRIPT.indexOf('inp = json.load'));
  let answer: Record<string, Xyz> = {};
  beforeAll(() => {
    const text = execFileSync('/usr/bin/python3', ['-c', FINE_SCRIPT, helpers], { input: JSON.stringify({ cmf: CMF_FILE, lamps: FINE_LAMPS }), encoding: 'utf8', maxBuffer: 16 << 20 });
    answer = JSON.parse(text) as Record<string, Xyz>;
  });
  for (const lamp of FINE_LAMPS) {
    it(lamp.label, () => {
      const ours = whitePoint(lightFromPairs(lamp.pairs));
      const theirs = answer[lamp.label];
      console.info(`${lamp.label}: white engine ${fmt(ours)}, numpy at 0.1 nm ${fmt(theirs)}`);
      for (let c = 0; c < 3; c++) expect(Math.abs(ours[c] - theirs[c]), `${'XYZ'[c]}: engine ${ours[c]}, numpy ${theirs[c]}`).toBeLessThanOrEqual(TOL_XYZ);
    });
  }
});

describe('surfaces with narrow bands given at 1 nm under D65 and A against numpy at 1 nm (within 0.1)', () => {
  for (const name of ['D65', 'A'] as const) {
    it(`under ${name}`, () => {
      compare(`CIE ${name}`, cieIlluminant(name), numpyXyz()[name]);
    });
  }
});

const FACTOR_SCRIPT = String.raw`
import json, sys
import numpy as np
root = sys.argv[1]
filters = {f["id"]: f["definition"] for f in json.load(open(root + "/data/library/filters.json"))["items"]}
media = {m["id"]: m["definition"] for m in json.load(open(root + "/data/library/media.json"))["items"]}
nm = np.arange(350, 901, 1.0)
LN81 = 2 * np.log(9)  # a logistic rises 10 % -> 90 % over ln 81 of its scale
def rising(x, edge, width): return 1 / (1 + np.exp(-(x - edge) / (max(width, 1e-6) / LN81)))
def gauss(x, c, fwhm): return np.exp(-0.5 * ((x - c) / (fwhm / (2 * np.sqrt(2 * np.log(2)))))**2)
def medium(d):
    m = d["model"]
    s = sum(l["weight"] * gauss(nm, l["centreNm"], l["widthNm"]) for l in m["lobes"])
    if "redEdgeNm" in m: s = s * (1 - rising(nm, m["redEdgeNm"], m.get("redEdgeWidthNm", 20)))
    if "blueEdgeNm" in m: s = s * rising(nm, m["blueEdgeNm"], m.get("blueEdgeWidthNm", 20))
    if m["basis"] == "quantum": s = s * nm
    return s / s.max()
def filt(d):
    p = d["longPass"]
    return np.clip(p.get("peak", 1) * rising(nm, p["cutOnNm"], p.get("slopeNm", 20)), 0, 1)
lam = nm * 1e-9
planck = 1 / (lam**5 * np.expm1(1.4388e-2 / (lam * float(sys.argv[2]))))
def trapz(y, x): return float(np.sum((y[1:] + y[:-1]) * np.diff(x)) / 2)
out = {}
for m in json.loads(sys.argv[3]):
    for f in json.loads(sys.argv[4]):
        S, T = medium(media[m]), filt(filters[f])
        res = {}
        for lo, hi in ((350, 900), (380, 780), (350, 780)):
            k = (nm >= lo) & (nm <= hi)
            res["%d-%d" % (lo, hi)] = trapz(planck[k] * S[k], nm[k]) / trapz(planck[k] * T[k] * S[k], nm[k])
        out[m + " " + f] = res
json.dump(out, sys.stdout)
`;

/** The lamp of the stack: a blackbody at 3200 K (tungsten studio lamp), Planck with c2 = 1.4388e-2 m·K. */
const STACK_K = 3200;
const STACK_MEDIA = ['infrared'];
const STACK_FILTERS = ['infrared-720', 'deep-red-630'];

describe('a blackbody-lit infrared-sensitive stack: filter factor against numpy over 350–900 nm (within 1 %)', () => {
  let ref: Record<string, Record<'350-900' | '380-780' | '350-780', number>> = {};
  beforeAll(() => {
    const text = execFileSync('/usr/bin/python3', ['-c', FACTOR_SCRIPT, ROOT, String(STACK_K), JSON.stringify(STACK_MEDIA), JSON.stringify(STACK_FILTERS)], { encoding: 'utf8' });
    ref = JSON.parse(text) as typeof ref;
  });
  for (const medium of STACK_MEDIA) {
    for (const filter of STACK_FILTERS) {
      it(`${filter} on ${medium} under a ${STACK_K} K blackbody`, () => {
        const f = filterFactor(blackbody(STACK_K), [resolveFilter({ id: filter })], resolveMedium({ id: medium }));
        const r = ref[`${medium} ${filter}`];
        expect(f.opaque).toBe(false);
        expect(Math.abs(f.factor / r['350-900'] - 1), `engine ${f.factor}, numpy ${r['350-900']}`).toBeLessThanOrEqual(TOL_FACTOR_REL);
        console.info(
          `${filter} on ${medium}, ${STACK_K} K: engine factor ${f.factor.toFixed(3)} (${f.stops.toFixed(3)} stops); numpy 350–900 nm ${r['350-900'].toFixed(3)}; ` +
            `had integration stopped at 780 nm: 380–780 nm (the old grid) ${r['380-780'].toFixed(3)} (${Math.log2(r['380-780']).toFixed(3)} stops, ×${(r['380-780'] / r['350-900']).toFixed(3)}), ` +
            `350–780 nm ${r['350-780'].toFixed(3)} (×${(r['350-780'] / r['350-900']).toFixed(3)})`,
        );
      });
    }
  }
});
