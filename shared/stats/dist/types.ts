/** Shapes shared by the distribution modules. */

/** Common shape of a continuous distribution. */
export interface Distribution {
  pdf(x: number): number;
  cdf(x: number): number;
  /** Upper tail P(X > x), computed directly (not as 1 − cdf) where it is the small tail. */
  sf(x: number): number;
  quantile(p: number): number;
}
