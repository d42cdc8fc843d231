// Distances on the WGS84 ellipsoid, as Art. 7(4) of Reg. 261/2004 uses the great-circle route.
import * as geographiclib from 'geographiclib-geodesic';
import { BAND_A_MAX_KM, BAND_B_MAX_KM, BAND_EDGE_REVIEW_KM } from './eu-uk-rules';
import { groupThousands } from './money';
import { assertDistanceKm } from './validation';

// The package is CommonJS: Node's ESM loader exposes it only as `default`, bundlers also by name.
const library = (geographiclib as unknown as { default?: typeof geographiclib }).default ?? geographiclib;
const WGS84 = library.Geodesic.WGS84;

export interface LatLon {
  lat: number;
  lon: number;
}

/** Shortest distance on the WGS84 ellipsoid (Karney's geodesic), in km, unrounded. */
export function greatCircleKm(from: LatLon, to: LatLon): number {
  assertLatLon('from', from);
  assertLatLon('to', to);
  const { s12 } = WGS84.Inverse(from.lat, from.lon, to.lat, to.lon);
  // Inverse always fills s12 under its default output mask; the type marks it optional for other masks.
  if (s12 === undefined) throw new Error('geodesic inverse returned no distance');
  return s12 / 1000;
}

function assertLatLon(field: string, point: LatLon): void {
  if (typeof point !== 'object' || point === null) throw new RangeError(`${field}: expected { lat, lon }`);
  if (typeof point.lat !== 'number' || !Number.isFinite(point.lat) || Math.abs(point.lat) > 90) {
    throw new RangeError(`${field}.lat: expected degrees between -90 and 90, got ${JSON.stringify(point.lat)}`);
  }
  if (typeof point.lon !== 'number' || !Number.isFinite(point.lon) || Math.abs(point.lon) > 180) {
    throw new RangeError(`${field}.lon: expected degrees between -180 and 180, got ${JSON.stringify(point.lon)}`);
  }
}

export interface BandEdgeWarning {
  edgeKm: number;
  distanceKm: number;
  differenceKm: number;
  message: string;
}

/** Flags a distance within 5 km of the 1,500 or 3,500 km edges: airport coordinates differ by source. */
export function bandEdgeWarning(distanceKm: number): BandEdgeWarning | null {
  assertDistanceKm('distanceKm', distanceKm);
  for (const edgeKm of [BAND_A_MAX_KM, BAND_B_MAX_KM]) {
    const differenceKm = Math.abs(distanceKm - edgeKm);
    if (differenceKm <= BAND_EDGE_REVIEW_KM) {
      return {
        edgeKm,
        distanceKm,
        differenceKm,
        message: `Distance ${distanceKm.toFixed(1)} km is within ${BAND_EDGE_REVIEW_KM} km of the ${groupThousands(edgeKm)} km band edge: check the airport coordinates before paying.`,
      };
    }
  }
  return null;
}
