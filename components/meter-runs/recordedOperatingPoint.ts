/**
 * A meter run's recent operating point from its hourly records, to start a range check from
 * what the meter actually sees: the lowest, median and highest flowing rate of the hours that
 * flowed, and the median of their flow-dependent average pressure and temperature.
 */
import type { HourlyRecord } from '@/hooks/api/totals';

/** Hours with less than this coverage say too little about the rate (a dropout, a start-up). */
const minimumCoverage = 0.9;

export interface RecordedOperatingPoint {
  hours: number;
  /** Flowing rates (mass over flow time), kg/s. */
  minimumKgPerS: number;
  normalKgPerS: number;
  maximumKgPerS: number;
  /** Median of the hours' average absolute static pressure, Pa, and temperature, K. */
  pressurePa: number | null;
  temperatureK: number | null;
  /** Density at base conditions implied by the records (mass / volume at base), kg/m³. */
  baseDensityKgPerM3: number | null;
}

function median(values: number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/**
 * @param records hourly records of the meter run
 * @returns the operating point, or null when no hour flowed with enough coverage
 */
export function recordedOperatingPoint(records: readonly HourlyRecord[]): RecordedOperatingPoint | null {
  const flowing = records.filter((r) => r.flowTimeS > 0 && r.massKg > 0 && r.coverage >= minimumCoverage);
  if (flowing.length === 0) return null;
  const rates = flowing.map((r) => r.massKg / r.flowTimeS);
  const pressures = flowing.map((r) => r.averagePressurePa).filter((v): v is number => v !== null);
  const temperatures = flowing.map((r) => r.averageTemperatureK).filter((v): v is number => v !== null);
  const mass = flowing.reduce((sum, r) => sum + r.massKg, 0);
  const volume = flowing.reduce((sum, r) => sum + r.standardVolumeM3, 0);
  return {
    hours: flowing.length,
    minimumKgPerS: Math.min(...rates),
    normalKgPerS: median(rates) ?? rates[0],
    maximumKgPerS: Math.max(...rates),
    pressurePa: median(pressures),
    temperatureK: median(temperatures),
    baseDensityKgPerM3: volume > 0 ? mass / volume : null,
  };
}
