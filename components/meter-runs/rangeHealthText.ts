/**
 * Range health's server-made sentences (the recommendation and the standard's limit warnings) are
 * written in SI and unit codes ("D = 49.2188 mm", "0.259 kg/s", "inH2O-60F"); on a site set to US
 * customary units every figure must be in the site's units. This rewrites each quantity it finds:
 * lengths in mm to the site's length unit, mass flows in kg/s to the site's mass flow unit, and
 * unit codes to their written labels. A sentence with no such figure is returned as it was.
 */
import {
  flowRateUnit,
  formatNumber,
  unitLabel,
  type DisplayUnitSet,
  type DisplayUnits,
} from '@/constants/units-display';
import { fromSI } from '@/shared/units';

const NUMBER = String.raw`(-?\d+(?:\.\d+)?(?:e[+-]?\d+)?)`;

/**
 * @param text a sentence from the range health report
 * @param set the site's display units
 * @param displayUnits the site's choice (sets the mass flow unit: lb/h or t/h)
 * @returns the sentence with its figures in the site's units
 */
export function rangeHealthTextInSiteUnits(text: string, set: DisplayUnitSet, displayUnits: DisplayUnits): string {
  const massUnit = flowRateUnit(displayUnits === 'us' ? 'lb/h' : 't/h');
  return text
    .replace(new RegExp(`${NUMBER} mm\\b`, 'g'), (_m, v: string) => {
      const metres = Number(v) / 1000;
      return `${formatNumber(metres / set.length.metresPerUnit)} ${set.length.label}`;
    })
    .replace(new RegExp(`${NUMBER} kg/s\\b`, 'g'), (_m, v: string) => {
      const perPeriod = fromSI(Number(v), massUnit.unit) * massUnit.secondsPerPeriod;
      return `${formatNumber(perPeriod)} ${massUnit.label}`;
    })
    .replace(/\b(inH2O-60F|inH2O-68F|inH2O-4C|degC|degF)\b/g, (code: string) => unitLabel(code));
}
