/**
 * The engine's one input error. Thrown when a spectrum, a source or a colour cannot be used, with the
 * path of the offending value (relative to what the caller passed, e.g. `['samples', 4, 0]`) and a
 * message a person can act on. The server turns it into a 400 whose `field` is the joined path.
 */
export class SpectralInputError extends Error {
  readonly name = 'SpectralInputError';
  constructor(
    readonly reason: string,
    readonly path: readonly (string | number)[] = [],
  ) {
    super(path.length ? `${path.join('.')}: ${reason}` : reason);
  }

  /** The same error, located under `prefix` (used when a source sits inside a larger request). */
  under(...prefix: (string | number)[]): SpectralInputError {
    return new SpectralInputError(this.reason, [...prefix, ...this.path]);
  }

  /** The dotted field path, e.g. `swatches.2.reflectance.5.0`; undefined at the top level. */
  get field(): string | undefined {
    return this.path.length ? this.path.join('.') : undefined;
  }
}

/** Runs `fn`, re-locating any SpectralInputError under `prefix`. */
export function within<T>(prefix: (string | number)[], fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    if (err instanceof SpectralInputError) throw err.under(...prefix);
    throw err;
  }
}
