import { FormBuilder } from '@angular/forms';
import { ConductorSize, ReadingKind, ReadingsInput, Stranding } from '@cc/shared';

/**
 * The readings part of the correction form: one group per kind, each with a switch saying it was taken.
 * Nothing is taken until the person ticks it: an untouched group records nothing (and no failure).
 */
export function readingsForm(fb: FormBuilder['nonNullable']) {
  const num = () => fb.control<number | null>(null);
  return fb.group({
    gfci: fb.group({ isTaken: [false], tripsOnTest: [false], resets: [false], downstreamProven: fb.control<number | null>(0), tripTimeMs: num(), testCurrentMa: num() }),
    receptacle: fb.group({ isTaken: [false], polarityCorrect: [false], groundPresent: [false] }),
    groundPath: fb.group({
      isTaken: [false],
      impedanceOhms: num(),
      conductorSize: fb.control<ConductorSize>('12'),
      stranding: fb.control<Stranding>('solid'),
      runLengthFt: num(),
      temperatureC: fb.control<number | null>(20),
    }),
    voltageDrop: fb.group({ isTaken: [false], percent: num(), loadAmps: num() }),
  });
}

export type ReadingsFormValue = ReturnType<ReturnType<typeof readingsForm>['getRawValue']>;

/** The readings DTO from the form: only the kinds the item asks for and that were taken. */
export function readingsOf(value: ReadingsFormValue, kinds: readonly ReadingKind[]): ReadingsInput {
  const taken = (kind: ReadingKind) => kinds.includes(kind) && value[kind].isTaken;
  const { gfci, receptacle, groundPath, voltageDrop } = value;
  return {
    gfci: taken('gfci')
      ? { tripsOnTest: gfci.tripsOnTest, resets: gfci.resets, downstreamProven: gfci.downstreamProven as number, tripTimeMs: gfci.tripTimeMs, testCurrentMa: gfci.testCurrentMa }
      : null,
    receptacle: taken('receptacle') ? { polarityCorrect: receptacle.polarityCorrect, groundPresent: receptacle.groundPresent } : null,
    groundPath: taken('groundPath')
      ? {
          impedanceOhms: groundPath.impedanceOhms as number,
          conductorSize: groundPath.conductorSize,
          stranding: groundPath.stranding,
          runLengthFt: groundPath.runLengthFt as number,
          temperatureC: groundPath.temperatureC ?? 20,
        }
      : null,
    voltageDrop: taken('voltageDrop') ? { percent: voltageDrop.percent as number, loadAmps: voltageDrop.loadAmps } : null,
  };
}
