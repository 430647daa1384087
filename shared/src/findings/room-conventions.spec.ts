import { parseText } from './report-parser';
import { alarmIsHouseWide, groundingRoom, houseWideAlarmCount, inOutdoorDisconnect } from './room-conventions';

/** (code, room, quantity) of every finding. */
function read(text: string) {
  return parseText(text).findings.map((f) => [f.code, f.room, f.quantity]);
}

// The lead's room conventions (seventh round, docs/parser.md and room-conventions.ts): the room is
// where the electrician goes to do the work. Each example is new text written for this spec, not a
// sentence of the corpus.

describe('grounding: a defect at the rod outdoors is exterior, at the panel or unplaced is panel (NFPA 70 (NEC) 2023, 250.53 rod electrodes, 250.70 clamps; room: common practice)', () => {
  it('puts a defect at the rod, its clamp or the conductor where it meets the rod outdoors', () => {
    expect(read('The grounding electrode conductor has been cut off a few inches above the driven rod.')).toEqual([['grounding-electrode', 'exterior', 1]]);
    expect(read('GEC clamp @ rod is corroded through.')).toEqual([['grounding-electrode', 'exterior', 1]]);
    expect(read('Ground rod by the gas meter: the acorn clamp is missing and the conductor is only twisted around it.')).toEqual([['grounding-electrode', 'exterior', 1]]);
  });

  it('keeps a defect at the panel end, or one with no place said, at the panel', () => {
    expect(read('The grounding electrode conductor from the rod is loose in its lug on the neutral bar of the panel.')).toEqual([['grounding-electrode', 'panel', 1]]);
    expect(read('The metal water piping is not bonded.')).toEqual([['grounding-electrode', 'panel', 1]]);
  });

  it('keeps a missing electrode (no rod to be at) where the text puts the missing system', () => {
    expect(groundingRoom('No ground rod or electrode conductor could be located for the service.', 'No ground rod or electrode conductor could be located for the service.', 'panel')).toBeNull();
  });

  it("gives the electrode a separately fed building lacks to that building's subpanel (NFPA 70 (NEC) 2023, 250.32(A))", () => {
    expect(read('No grounding electrode was found for the detached workshop, which is fed by a feeder from the house.')).toEqual([['grounding-electrode', 'panel', 1]]);
  });
});

describe('subpanels: their defects are panel wherever the subpanel is (NFPA 70 (NEC) 2023, 250.24(A)(5) and 408.40; room: common practice)', () => {
  it('places a subpanel in the garage at the panel', () => {
    expect(read('In the garage subpanel the neutrals and equipment grounds share one bar and the bonding screw is in.')).toEqual([['subpanel-bonding', 'panel', 1]]);
  });
});

describe('overcurrent: a device in an outdoor disconnect is exterior, in a panel panel (NFPA 70 (NEC) 2023, 110.3(B) and 440.22; room: common practice)', () => {
  it('puts a fused disconnect beside the outdoor unit outside', () => {
    expect(read('The fused disconnect next to the heat pump holds 40 A fuses; the heat pump data plate says MAX FUSE 25 A.')).toEqual([['overcurrent-mismatch', 'exterior', 1]]);
  });

  it('reads the disconnect from the sentence before when the nameplate comes second', () => {
    expect(inOutdoorDisconnect('The data plate on the pump motor allows 20 A at most.', 'The breaker in the pool disconnect by the equipment pad is 30 A.')).toBe(true);
  });

  it('keeps a breaker in the panel, and a service disconnect, at the panel', () => {
    expect(read('In the main panel the condenser is on a 50 A breaker; the condenser label lists a max breaker of 30 A.')).toEqual([['overcurrent-mismatch', 'panel', 1]]);
    expect(inOutdoorDisconnect('The main disconnect beside the meter is 100 A.', '')).toBe(false);
  });
});

describe('alarms: missing for the house as a whole is whole-house even when the remedy names a room (NFPA 72 (2022), 29.5 for where alarms go; room: common practice)', () => {
  it('keeps a house-wide statement house-wide whatever room the remedy names', () => {
    expect(read('Family room: there is a pellet stove here but no CO alarm in the house at all. Install a CO alarm in the family room.')).toEqual([['smoke-co-alarm', 'whole-house', 1]]);
    expect(read('CO alarm: none found -> put one in the upstairs hall.')).toEqual([['smoke-co-alarm', 'whole-house', 1]]);
  });

  it('keeps a missing alarm at the room named as where it is missing', () => {
    expect(read('No smoke alarm was found anywhere in the basement.')).toEqual([['smoke-co-alarm', 'basement', 1]]);
    expect(alarmIsHouseWide('no CO alarm in the hallway outside the bedrooms', null, 'hallway')).toBe(false);
  });

  it('reads "none found" as house-wide only for carbon monoxide alarms, and not under a room heading', () => {
    expect(alarmIsHouseWide('CO: none found', null, 'hallway')).toBe(true);
    expect(alarmIsHouseWide('Smoke alarm: none found', null, 'bedroom')).toBe(false);
    expect(alarmIsHouseWide('CO: none found', 'basement', 'basement')).toBe(false);
  });

  it('counts a house-wide missing alarm as the one its remedy installs, else none (issue 10: a singular named device is 1)', () => {
    expect(houseWideAlarmCount('Install one CO alarm outside the sleeping rooms.')).toBe(1);
    expect(houseWideAlarmCount(' -> install min 1 near the bedrooms')).toBe(1);
    expect(houseWideAlarmCount('Install CO alarms on every level.')).toBeNull();
    expect(houseWideAlarmCount('Install a smoke alarm in each bedroom.')).toBeNull();
  });
});
