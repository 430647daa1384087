import { copperResistanceOhms, TABLE_8_SOURCE } from './conductor-resistance';
import { GFCI_CURVE_MAX_MA, GFCI_CURVE_MIN_MA, GFCI_CURVE_SOURCE, GFCI_NO_TRIP_BELOW_MA, maxGfciTripSeconds } from './gfci-trip-time';
import type { ReadingEvaluation, Readings } from './readings.schema';
import { BRANCH_DROP_PERCENT, TOTAL_DROP_PERCENT, VOLTAGE_DROP_SOURCE, voltageDropPercent } from './voltage-drop';

/** The usual ceiling for a ground-path impedance reading (common practice rule of thumb). */
export const GROUND_PATH_LIMIT_OHMS = 1;
/** What sound terminations add to the conductor's own resistance (common practice: a few hundredths each). */
export const TERMINATIONS_ALLOWANCE_OHMS = 0.1;
/** A reading more than this many times the expected range's top flags a poor connection. */
export const POOR_CONNECTION_FACTOR = 2;

const GROUND_PATH_SOURCE = `${TABLE_8_SOURCE}; < ${GROUND_PATH_LIMIT_OHMS} Ω is common practice`;
const RECEPTACLE_SOURCE = 'NFPA 70 (NEC) 200.11 (polarity) and 250.146 / 406.4(D)(2) (equipment ground or GFCI and labels)';
const GFCI_FUNCTION_SOURCE = 'Device TEST and RESET, downstream proven (manufacturer instructions; common practice)';

const round = (value: number, digits: number) => Number(value.toFixed(digits));
const ohms = (value: number) => `${round(value, 3)} Ω`;
const yesNo = (value: boolean) => (value ? 'Yes' : 'No');

/** Optional facts about the correction that change what a reading should be. */
export interface ReadingContext {
  /** Labels applied at the device, e.g. "No Equipment Ground" where GFCI protection stands in for a ground. */
  labels?: readonly string[];
}

/** Each reading of a correction with whether it is within the expected range and the source it is judged by. */
export function evaluateReadings(readings: Readings, context: ReadingContext = {}): ReadingEvaluation[] {
  const out: ReadingEvaluation[] = [];
  const { gfci, receptacle, groundPath, voltageDrop } = readings;
  if (gfci) {
    out.push(check('gfci.tripsOnTest', 'Trips on its TEST button', yesNo(gfci.tripsOnTest), gfci.tripsOnTest, 'Yes', GFCI_FUNCTION_SOURCE));
    out.push(check('gfci.resets', 'Resets', yesNo(gfci.resets), gfci.resets, 'Yes', GFCI_FUNCTION_SOURCE));
    out.push({ key: 'gfci.downstreamProven', label: 'Downstream receptacles proven', value: String(gfci.downstreamProven), status: 'recorded', expected: 'Every receptacle the device protects', source: null });
    if (gfci.tripTimeMs !== null && gfci.testCurrentMa !== null) out.push(evaluateTripTime(gfci.tripTimeMs, gfci.testCurrentMa));
  }
  if (receptacle) {
    out.push(check('receptacle.polarityCorrect', 'Polarity correct', yesNo(receptacle.polarityCorrect), receptacle.polarityCorrect, 'Yes', RECEPTACLE_SOURCE));
    const isLabelledUngrounded = (context.labels ?? []).includes('No Equipment Ground');
    out.push(
      isLabelledUngrounded && !receptacle.groundPresent
        ? { key: 'receptacle.groundPresent', label: 'Equipment ground present', value: 'No', status: 'within', expected: 'None: GFCI-protected and labelled "No Equipment Ground"', source: RECEPTACLE_SOURCE }
        : check('receptacle.groundPresent', 'Equipment ground present', yesNo(receptacle.groundPresent), receptacle.groundPresent, 'Yes', RECEPTACLE_SOURCE),
    );
  }
  if (groundPath) {
    const expected = copperResistanceOhms(groundPath.conductorSize, groundPath.runLengthFt, groundPath.temperatureC, groundPath.stranding);
    const top = expected + TERMINATIONS_ALLOWANCE_OHMS;
    const measured = groundPath.impedanceOhms;
    const status = measured >= GROUND_PATH_LIMIT_OHMS ? 'outside' : measured > POOR_CONNECTION_FACTOR * top ? 'flag' : 'within';
    out.push({
      key: 'groundPath.impedanceOhms',
      label: `Ground-path impedance (${groundPath.runLengthFt} ft of ${groundPath.conductorSize} AWG at ${groundPath.temperatureC} °C)`,
      value: ohms(measured),
      status,
      expected: `About ${ohms(expected)} of conductor, ${ohms(expected)}–${ohms(top)} with terminations; under ${GROUND_PATH_LIMIT_OHMS} Ω${status === 'flag' ? '. Far above the expected value: look for a poor connection' : ''}`,
      source: GROUND_PATH_SOURCE,
    });
  }
  if (voltageDrop) {
    const { percent, loadAmps } = voltageDrop;
    const status = percent <= BRANCH_DROP_PERCENT ? 'within' : percent <= TOTAL_DROP_PERCENT ? 'flag' : 'outside';
    const estimate =
      loadAmps !== null && groundPath ? ` (about ${round(voltageDropPercent(groundPath.conductorSize, loadAmps, groundPath.runLengthFt), 2)} % expected at ${loadAmps} A over this run)` : '';
    out.push({
      key: 'voltageDrop.percent',
      label: `Voltage drop under load${loadAmps !== null ? ` (${loadAmps} A)` : ''}`,
      value: `${round(percent, 2)} %`,
      status,
      expected: `At most ${BRANCH_DROP_PERCENT} % on the branch, ${TOTAL_DROP_PERCENT} % with the feeder${estimate}`,
      source: VOLTAGE_DROP_SOURCE,
    });
  }
  return out;
}

/** A measured trip time against the UL 943 maximum at the instrument's test current. */
export function evaluateTripTime(tripTimeMs: number, testCurrentMa: number): ReadingEvaluation {
  const limit = maxGfciTripSeconds(testCurrentMa);
  const base = { key: 'gfci.tripTimeMs', label: `Trip time at ${round(testCurrentMa, 1)} mA`, value: `${round(tripTimeMs, 1)} ms`, source: GFCI_CURVE_SOURCE };
  if (limit === null) {
    const why =
      testCurrentMa < GFCI_NO_TRIP_BELOW_MA
        ? `Below ${GFCI_NO_TRIP_BELOW_MA} mA a Class A GFCI must not trip`
        : testCurrentMa < GFCI_CURVE_MIN_MA
          ? `Between ${GFCI_NO_TRIP_BELOW_MA} and ${GFCI_CURVE_MIN_MA} mA a Class A GFCI may or may not trip`
          : `The curve is stated for ${GFCI_CURVE_MIN_MA}–${GFCI_CURVE_MAX_MA} mA only`;
    return { ...base, status: 'recorded', expected: `${why}; no maximum time applies` };
  }
  const limitMs = limit * 1000;
  return {
    ...base,
    status: tripTimeMs <= limitMs ? 'within' : 'outside',
    expected: `At most ${round(limitMs, limitMs < 100 ? 1 : 0)} ms`,
  };
}

function check(key: string, label: string, value: string, isGood: boolean, expected: string, source: string): ReadingEvaluation {
  return { key, label, value, status: isGood ? 'within' : 'outside', expected, source };
}

/** Whether any reading is outside its expected range. */
export function hasReadingOutside(evaluations: readonly ReadingEvaluation[]): boolean {
  return evaluations.some((e) => e.status === 'outside');
}
