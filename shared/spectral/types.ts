/**
 * The plain value types of the spectral engine. No code and no imports: every other engine file may
 * import from here, so the types never tie two engine files into a cycle.
 */

/** A regular wavelength sampling, nm. */
export interface SpectrumShape {
  readonly startNm: number;
  readonly endNm: number;
  readonly stepNm: number;
}

/** A sampled spectral quantity (power, transmittance, sensitivity or reflectance) on `shape`. */
export interface Spectrum {
  readonly shape: SpectrumShape;
  readonly values: Float64Array;
}

/** `[nm, value]` pairs as they arrive from files, forms and the API. */
export type SpectralPairs = readonly (readonly [number, number])[];

/** XYZ tristimulus values, Y = 100 for the perfect reflecting diffuser under the light. */
export type Xyz = [number, number, number];

/** An RGB triple, each 0..1 (encoded sRGB or linear, as the name says). */
export type Rgb3 = [number, number, number];

/** CIE 1976 L*, a*, b*. */
export type Lab3 = [number, number, number];
