/**
 * The `cubic-spline` package (npm, MIT): a natural cubic spline built differently from the product's
 * (knot slopes from a dense linear system solved by Gaussian elimination, evaluated in Hermite form),
 * used only by tests as an independent reference. CommonJS without types: loaded through createRequire.
 */
import { createRequire } from 'node:module';

/** The package's spline: `new Spline(xs, ys).at(x)`. */
export interface ReferenceSpline { at(x: number): number }

const Spline = createRequire(import.meta.url)('cubic-spline') as new (xs: number[], ys: number[]) => ReferenceSpline;

/** A natural cubic spline through (xs, ys) from the reference package. */
export function referenceSpline(xs: number[], ys: number[]): ReferenceSpline {
  return new Spline(xs, ys);
}
