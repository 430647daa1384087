import turfDistance from '@turf/distance';
import { distanceMatrix, driveMinutes, greatCircleKm, greatCircleMiles, KM_PER_MILE, roadMiles, type LatLng } from './great-circle';

const turfKm = (a: LatLng, b: LatLng) => turfDistance([a.longitude, a.latitude], [b.longitude, b.latitude], { units: 'kilometers' });

/** A small deterministic generator, so the sample points are the same on every run. */
function points(count: number, seed: number): LatLng[] {
  let state = seed;
  const next = () => ((state = (state * 1_103_515_245 + 12_345) % 2_147_483_648) / 2_147_483_648);
  return Array.from({ length: count }, () => ({ latitude: -85 + 170 * next(), longitude: -180 + 360 * next() }));
}

describe('greatCircleKm', () => {
  it('agrees with the reference library @turf/distance to a millimetre on 200 pairs around the globe', () => {
    const sample = points(400, 7);
    for (let i = 0; i < sample.length; i += 2) {
      expect(Math.abs(greatCircleKm(sample[i], sample[i + 1]) - turfKm(sample[i], sample[i + 1]))).toBeLessThan(1e-6);
    }
  });

  it('agrees with @turf/distance on the short hops of a town (a few miles)', () => {
    const shop = { latitude: 38.832791, longitude: -104.813816 };
    for (const [dLat, dLng] of [[0.01, 0], [0, 0.02], [0.05, -0.04], [-0.12, 0.09]]) {
      const stop = { latitude: shop.latitude + dLat, longitude: shop.longitude + dLng };
      expect(greatCircleKm(shop, stop)).toBeCloseTo(turfKm(shop, stop), 9);
    }
  });

  it('matches the published worked example LAX–JFK: 2144 nautical miles (Ed Williams, Aviation Formulary V1.47, "Distance between points"; from memory)', () => {
    // LAX 33°57′N 118°24′W, JFK 40°38′N 73°47′W; the formulary uses a sphere of 1 nm per arc minute.
    const lax = { latitude: 33 + 57 / 60, longitude: -(118 + 24 / 60) };
    const jfk = { latitude: 40 + 38 / 60, longitude: -(73 + 47 / 60) };
    const nauticalMiles = greatCircleKm(lax, jfk) / 1.852; // 1 nm = 1.852 km exactly (international nautical mile)
    expect(Math.abs(nauticalMiles - 2144) / 2144).toBeLessThan(0.002);
  });

  it('matches the published worked example BNA–LAX: about 2886 km (Wikipedia, "Great-circle distance", worked example; from memory)', () => {
    // Nashville BNA 36°7.2′N 86°40.2′W, Los Angeles LAX 33°56.4′N 118°24.0′W.
    const bna = { latitude: 36 + 7.2 / 60, longitude: -(86 + 40.2 / 60) };
    const lax = { latitude: 33 + 56.4 / 60, longitude: -(118 + 24 / 60) };
    expect(greatCircleKm(bna, lax)).toBeGreaterThan(2880);
    expect(greatCircleKm(bna, lax)).toBeLessThan(2892);
  });

  it('is zero from a point to itself and the same both ways', () => {
    const [a, b] = points(2, 11);
    expect(greatCircleKm(a, a)).toBe(0);
    expect(greatCircleKm(a, b)).toBeCloseTo(greatCircleKm(b, a), 9);
  });

  it('answers miles as kilometres over 1.609344 (international mile)', () => {
    const [a, b] = points(2, 3);
    expect(greatCircleMiles(a, b) * KM_PER_MILE).toBeCloseTo(greatCircleKm(a, b), 9);
  });
});

describe('driveMinutes', () => {
  const assumptions = { roadFactorPercent: 130, averageSpeedMph: 30 };

  it('is the straight line times the road factor over the average speed, rounded up to a whole minute', () => {
    const a = { latitude: 38.8, longitude: -104.8 };
    const b = { latitude: 38.9, longitude: -104.8 };
    const expected = Math.ceil(((greatCircleMiles(a, b) * 1.3) / 30) * 60);
    expect(driveMinutes(a, b, assumptions)).toBe(expected);
    expect(roadMiles(10, assumptions)).toBeCloseTo(13, 9);
  });

  it('is zero for the same place and at least a minute for any other', () => {
    const a = { latitude: 38.8, longitude: -104.8 };
    expect(driveMinutes(a, a, assumptions)).toBe(0);
    expect(driveMinutes(a, { latitude: 38.8001, longitude: -104.8 }, assumptions)).toBe(1);
  });

  it('puts nearby ZIP areas of one town within the 20–30 minutes a short-visit day allows (common practice)', () => {
    // Two ZIP centroids about 6 miles apart: at 30 mph and a 1.3 road factor, well under half an hour.
    const a = { latitude: 38.832791, longitude: -104.813816 };
    const b = { latitude: 38.752594, longitude: -104.878211 };
    expect(driveMinutes(a, b, assumptions)).toBeLessThanOrEqual(30);
  });
});

describe('distanceMatrix', () => {
  it('holds every pairwise distance, symmetric with a zero diagonal', () => {
    const sample = points(5, 5);
    const m = distanceMatrix(sample);
    for (let i = 0; i < 5; i++) {
      expect(m[i * 5 + i]).toBe(0);
      for (let j = 0; j < 5; j++) expect(m[i * 5 + j]).toBeCloseTo(turfKm(sample[i], sample[j]), 6);
    }
  });
});
