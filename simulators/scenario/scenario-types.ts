/**
 * Shapes of the demo scenario's definition (SCENARIO.md): the data that the seed writes into the
 * database and that the simulators read to produce readings. SI inside, as everywhere.
 */
import type { ElementSpec } from '../../shared/flow/flow-types';
import type { FluidSpec } from '../../shared/fluids';
import type { TransmitterInput, MeterRunInput, SiteInput } from '../../shared/schemas/setup';

/** A site with the MQTT credentials of its demo simulator. */
export interface ScenarioSite extends Omit<SiteInput, 'displayUnits'> {
  displayUnits: 'si' | 'us';
  /** The demo simulator's device: its username is fixed, its password derives from the demo password. */
  device: { name: string; username: string };
}

/** A transmitter as the set-up API takes it, without the meter run id (filled in by the seed). */
export type ScenarioTransmitter = Omit<
  TransmitterInput,
  'meterRunId' | 'pressureReference' | 'stackRole' | 'accuracyPercentOfSpan'
> & {
  pressureReference: 'absolute' | 'gauge';
  stackRole: 'single' | 'low' | 'high';
  accuracyPercentOfSpan: number;
};

/** How much flows at the nominal operating point, before load shape and decline. */
export type NominalFlow =
  | { kind: 'standard-volume'; m3PerS: number }
  | { kind: 'mass'; kgPerS: number }
  | { kind: 'volume'; m3PerS: number }
  /** An outlet that carries its inlets' mass less a share (fuel and losses), instant by instant. */
  | { kind: 'balance-outlet'; inletTags: string[]; lossShare: number };

/** The shape of the load over time. */
export interface LoadProfile {
  /** Half the peak-to-trough swing of the flow over a day, as a share of the mean. */
  diurnalAmplitude: number;
  /** Local hour (0–24) of the daily peak. */
  peakHourLocal: number;
  /** Share of flow lost per month (decline of a well), 0 for a steady process. */
  declinePerMonth: number;
  /** Standard deviation of the flow's own fluctuation (turbulence, control), share of flow. */
  noiseShare: number;
}

/** The line conditions and flow a meter run runs at. */
export interface OperatingPoint {
  flow: NominalFlow;
  load: LoadProfile;
  /** Static pressure at the upstream tap, gauge, Pa (absolute = gauge + the site's atmospheric pressure). */
  staticPressureGaugePa: number;
  /** Half the daily swing of the static pressure, Pa (line pack, header control). */
  staticPressureSwingPa: number;
  temperatureK: number;
  /** Half the daily swing of the flowing temperature, K (sun on the pipe, cooling tower). */
  temperatureSwingK: number;
}

/** A configuration change of the scenario: a new element from a local time of the demo month on. */
export interface ScenarioElementChange {
  /** Day of the demo month and local time (the site's zone) at which the new element takes effect. */
  day: number;
  hour: number;
  minute: number;
  element: ElementSpec;
  reason: string;
}

export interface ScenarioMeterRun extends Omit<
  MeterRunInput,
  'siteId' | 'effectiveFrom' | 'element' | 'fluid' | 'line'
> {
  siteCode: string;
  element: ElementSpec;
  fluid: FluidSpec;
  line: NonNullable<MeterRunInput['line']>;
  transmitters: ScenarioTransmitter[];
  operating: OperatingPoint;
  elementChange?: ScenarioElementChange;
}
