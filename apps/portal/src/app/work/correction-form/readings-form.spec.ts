import { TestBed } from '@angular/core/testing';
import { FormBuilder } from '@angular/forms';
import { evaluateReadings, ReadingsSchema } from '@cc/shared';
import { readingsForm, readingsOf } from './readings-form';

describe('readingsForm', () => {
  const form = () => readingsForm(TestBed.inject(FormBuilder).nonNullable);

  it('takes no reading until the person ticks "Taken": an untouched form records no failure', () => {
    const readings = ReadingsSchema.parse(readingsOf(form().getRawValue(), ['gfci', 'receptacle', 'groundPath', 'voltageDrop']));
    expect(readings).toEqual({ gfci: null, receptacle: null, groundPath: null, voltageDrop: null });
    expect(evaluateReadings(readings)).toEqual([]);
  });

  it('judges polarity and ground once taken and entered (NFPA 70 (NEC) 200.11, 250.146)', () => {
    const f = form();
    f.controls.receptacle.setValue({ isTaken: true, polarityCorrect: true, groundPresent: true });
    const evaluations = evaluateReadings(ReadingsSchema.parse(readingsOf(f.getRawValue(), ['receptacle'])));
    expect(evaluations.map((e) => [e.key, e.status])).toEqual([
      ['receptacle.polarityCorrect', 'within'],
      ['receptacle.groundPresent', 'within'],
    ]);
  });
});
