/** Types of the vendored @stdlib bundle (vendor/build.ts): each function as its package exports it. */
/** Student t CDF at t with ν degrees of freedom (@stdlib/stats-base-dists-t-cdf). */
export declare function tCdf(t: number, dof: number): number;
/** Normal quantile (@stdlib/stats-base-dists-normal-quantile). */
export declare function normalQuantile(p: number, mu: number, sigma: number): number;
/** Normal CDF (@stdlib/stats-base-dists-normal-cdf). */
export declare function normalCdf(x: number, mu: number, sigma: number): number;
/** F CDF (@stdlib/stats-base-dists-f-cdf). */
export declare function fCdf(x: number, d1: number, d2: number): number;
/** χ² CDF (@stdlib/stats-base-dists-chisquare-cdf). */
export declare function chiSquareCdf(x: number, dof: number): number;
/** Cosine of an angle in radians (@stdlib/math-base-special-cos, an fdlibm port). */
export declare function cos(x: number): number;
