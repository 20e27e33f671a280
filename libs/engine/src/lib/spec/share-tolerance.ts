/**
 * How far given shares may miss a total of 1. Within EXACT they are used as given (normalised
 * only to remove float noise); up to ROUNDING they are treated as rounded published figures
 * and renormalised with a warning; beyond that they are an error. Common practice, no source:
 * published tables round shares to two or three decimals, which can leave the total off by a
 * few thousandths.
 */
export const SHARE_SUM_EXACT_TOLERANCE = 1e-6;
export const SHARE_SUM_ROUNDING_TOLERANCE = 0.01;
