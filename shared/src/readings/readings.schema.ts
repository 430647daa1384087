import * as z from 'zod';
import { wholeNumber } from '../http/bounds';
import { CONDUCTOR_SIZES, STRANDINGS } from './conductor-resistance';

const bounded = (min: number, max: number, unit: string) =>
  z
    .number({ error: `Enter a number of ${unit}` })
    .refine(Number.isFinite, 'Enter a number')
    .min(min, `Use at least ${min} ${unit}`)
    .max(max, `Use at most ${max} ${unit}`);

export const GfciReadingSchema = z
  .object({
    /** Whether the device tripped on its own TEST button (power off there and downstream). */
    tripsOnTest: z.boolean(),
    /** Whether it reset and power came back everywhere. */
    resets: z.boolean(),
    /** Downstream receptacles proven to be protected. */
    downstreamProven: wholeNumber(0, 40, 'how many downstream receptacles were proven'),
    tripTimeMs: bounded(1, 10_000, 'ms').nullable().default(null),
    testCurrentMa: bounded(1, 300, 'mA').nullable().default(null),
  })
  .refine((g) => (g.tripTimeMs === null) === (g.testCurrentMa === null), {
    error: 'Enter the trip time together with the test current',
    path: ['testCurrentMa'],
  });

export const ReceptacleReadingSchema = z.object({
  polarityCorrect: z.boolean(),
  groundPresent: z.boolean(),
});

export const GroundPathReadingSchema = z.object({
  impedanceOhms: bounded(0, 100, 'Ω'),
  conductorSize: z.enum(CONDUCTOR_SIZES),
  stranding: z.enum(STRANDINGS).default('solid'),
  runLengthFt: bounded(1, 1000, 'ft'),
  temperatureC: bounded(-30, 60, '°C').default(20),
});

export const VoltageDropReadingSchema = z.object({
  percent: bounded(0, 50, '%'),
  loadAmps: bounded(1, 30, 'A').nullable().default(null),
});

/** The test readings of one correction; a group is null when it was not taken. */
export const ReadingsSchema = z.object({
  gfci: GfciReadingSchema.nullable().default(null),
  receptacle: ReceptacleReadingSchema.nullable().default(null),
  groundPath: GroundPathReadingSchema.nullable().default(null),
  voltageDrop: VoltageDropReadingSchema.nullable().default(null),
});
export type Readings = z.output<typeof ReadingsSchema>;
export type ReadingsInput = z.input<typeof ReadingsSchema>;

export const READING_STATUSES = ['within', 'outside', 'flag', 'recorded'] as const;
export type ReadingStatus = (typeof READING_STATUSES)[number];

export const ReadingEvaluationSchema = z.object({
  key: z.string(),
  label: z.string(),
  value: z.string(),
  /** within / outside the expected range; flag: within the limit but worth a look; recorded: no range applies. */
  status: z.enum(READING_STATUSES),
  expected: z.string(),
  source: z.string().nullable(),
});
export type ReadingEvaluation = z.infer<typeof ReadingEvaluationSchema>;
