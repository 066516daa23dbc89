/**
 * Dose helpers of the trade: one-repetition maximum, hang loads, time under load, session
 * spacing, effort levels and intensity conversions.
 *
 * @example
 * import { oneRepMax, hangLoad, intensityFromLoad } from '@/lib/training';
 *
 * @module
 */
export * from './dose';
