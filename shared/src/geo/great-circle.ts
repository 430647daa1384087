// Distances over the earth's surface for the day plan. Pure computation: degrees in, miles out.

/** A point as latitude and longitude in decimal degrees (WGS 84). */
export interface LatLng {
  latitude: number;
  longitude: number;
}

/** The mean earth radius R1 = (2a + b) / 3 of WGS 84, in kilometres (IUGG; from memory: 6371.0088 km). */
export const EARTH_MEAN_RADIUS_KM = 6371.0088;

/** International mile: exactly 1.609344 km (the 1959 international yard and pound agreement). */
export const KM_PER_MILE = 1.609344;

const toRadians = (degrees: number) => (degrees * Math.PI) / 180;

/** Great-circle distance between two points in kilometres (haversine formula on a sphere). */
export function greatCircleKm(a: LatLng, b: LatLng): number {
  const dLat = toRadians(b.latitude - a.latitude);
  const dLng = toRadians(b.longitude - a.longitude);
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(toRadians(a.latitude)) * Math.cos(toRadians(b.latitude)) * Math.sin(dLng / 2) ** 2;
  return 2 * EARTH_MEAN_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** Great-circle distance between two points in miles. */
export function greatCircleMiles(a: LatLng, b: LatLng): number {
  return greatCircleKm(a, b) / KM_PER_MILE;
}

/** How the straight line becomes a drive: roads are longer than the line, and driven at an average speed. */
export interface DriveAssumptions {
  /** Road distance per straight-line distance, in percent (130 = roads are 1.3 times the line). */
  roadFactorPercent: number;
  /** Average speed of the drive in miles per hour. */
  averageSpeedMph: number;
}

/** Road miles of a straight-line distance. */
export function roadMiles(straightMiles: number, assumptions: DriveAssumptions): number {
  return (straightMiles * assumptions.roadFactorPercent) / 100;
}

/** Whole minutes of driving between two points (rounded up: a drive of 0.2 minutes still takes one). */
export function driveMinutes(a: LatLng, b: LatLng, assumptions: DriveAssumptions): number {
  const miles = roadMiles(greatCircleMiles(a, b), assumptions);
  return miles === 0 ? 0 : Math.ceil((miles / assumptions.averageSpeedMph) * 60 - 1e-9);
}

/** A matrix of pairwise great-circle distances (kilometres), row-major, for ordering a route. */
export function distanceMatrix(points: readonly LatLng[]): Float64Array {
  const n = points.length;
  const matrix = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const d = greatCircleKm(points[i], points[j]);
      matrix[i * n + j] = d;
      matrix[j * n + i] = d;
    }
  }
  return matrix;
}
