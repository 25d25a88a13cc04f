/** ISO 6976:2016 calorific value, density, relative density and Wobbe index (public surface). */
export { iso6976Properties } from './iso6976-properties';
export type { Iso6976Properties } from './iso6976-properties';
