// Records of the proof side used by several API test files.

/** A GFCI receptacle recorded as corrected, with the readings that pass (see shared/src/readings). */
export const gfciRecord = (overrides: object = {}) => ({
  outcome: 'corrected',
  workPerformed: 'Replaced the worn GFCI receptacle at the first device of the run',
  materials: '20 A tamper- and weather-resistant GFCI receptacle',
  deviceMake: 'Acme Devices',
  deviceModel: 'GF20-TR',
  deviceLot: '2026-41',
  labels: ['GFCI Protected'],
  readings: {
    gfci: { tripsOnTest: true, resets: true, downstreamProven: 2, tripTimeMs: 27, testCurrentMa: 7.4 },
    receptacle: { polarityCorrect: true, groundPresent: true },
    groundPath: { impedanceOhms: 0.12, conductorSize: '12', runLengthFt: 50, temperatureC: 20 },
  },
  ...overrides,
});
