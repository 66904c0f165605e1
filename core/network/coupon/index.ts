/** The laminate from a measured coupon: propagation constant (multiline), effective permittivity, the fit. */
export { extractLaminate } from './extract.ts';
export type { CouponExtractInput, CouponLineFile, CouponPoint, CouponResult } from './extract.ts';
export { multilineGamma, pairEstimate, sToT, eigenvalues2 } from './marks-1991-multiline.ts';
export type { Mat2, MultilineEstimate, PairEstimate } from './marks-1991-multiline.ts';
export { effectivePermittivityFromGamma, gammaFromEffectivePermittivity } from './janezic-jargon-1999.ts';
