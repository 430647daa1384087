import { GfciReadingSchema, GroundPathReadingSchema, ReceptacleReadingSchema, VoltageDropReadingSchema, type Readings, type ReadingsInput } from './readings.schema';

const GROUPS = { gfci: GfciReadingSchema, receptacle: ReceptacleReadingSchema, groundPath: GroundPathReadingSchema, voltageDrop: VoltageDropReadingSchema } as const;
type Group = keyof typeof GROUPS;

/**
 * Valid values that stand in for a field typed out of range, so that the rest of its group can still be
 * judged; the stand-in itself is never judged (its key is in `unjudged`). A trip time and its test
 * current stand in together (one is judged only with the other).
 */
const STAND_INS: Record<Group, Record<string, unknown>> = {
  gfci: { tripsOnTest: false, resets: false, downstreamProven: 0, tripTimeMs: null, testCurrentMa: null },
  receptacle: { polarityCorrect: false, groundPresent: false },
  groundPath: { impedanceOhms: 0, conductorSize: '12', stranding: 'solid', runLengthFt: 1, temperatureC: 20 },
  voltageDrop: { percent: 0, loadAmps: null },
};
const TOGETHER: Partial<Record<string, string>> = { 'gfci.tripTimeMs': 'testCurrentMa', 'gfci.testCurrentMa': 'tripTimeMs' };

/**
 * The readings as typed so far, ready to be judged while a form is being filled in: each group is read
 * on its own, and a field that is out of range or incomplete is left unjudged (`unjudged`, keys such as
 * `gfci.downstreamProven`) instead of keeping every other reading from being judged. What is recorded is
 * still checked whole by `ReadingsSchema`.
 */
export function readingsToJudge(input: ReadingsInput): { readings: Readings; unjudged: string[] } {
  const readings: Readings = { gfci: null, receptacle: null, groundPath: null, voltageDrop: null };
  const unjudged: string[] = [];
  for (const group of Object.keys(GROUPS) as Group[]) {
    const value = input[group] as Record<string, unknown> | null | undefined;
    if (!value) continue;
    const schema = GROUPS[group];
    let parsed = schema.safeParse(value);
    if (!parsed.success) {
      const patched = { ...value };
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0] ?? '');
        const fields = [field, TOGETHER[`${group}.${field}`]].filter((f): f is string => !!f && f in STAND_INS[group]);
        for (const f of fields) {
          patched[f] = STAND_INS[group][f];
          if (!unjudged.includes(`${group}.${f}`)) unjudged.push(`${group}.${f}`);
        }
      }
      parsed = schema.safeParse(patched);
      if (!parsed.success) {
        unjudged.push(group);
        continue;
      }
    }
    (readings as Record<Group, unknown>)[group] = parsed.data;
  }
  return { readings, unjudged };
}
