import {
  dayPlanWarnings,
  distanceMatrix,
  driveMinutes,
  greatCircleMiles,
  KM_PER_MILE,
  minutesOfDay,
  orderWithinWindows,
  orderStops,
  scheduleDay,
  type DayPlan,
  type DayPlanStop,
  type LatLng,
  type Place,
} from '@cc/shared';
import type { Db } from '../db/knex';
import { DayPlanRepository, type PlannedVisitRecord, type PropertyRecord, type StoredDayPlanSettings } from './day-plan.repository';
import { zipCentroid } from './zip-centroids';

/** Where a property is: the coordinates entered for it, else its ZIP code's centre, else unknown. */
export function placeOf(property: Pick<PropertyRecord, 'zip' | 'latitude' | 'longitude'>): Place | null {
  if (property.latitude !== null && property.longitude !== null) return { latitude: property.latitude, longitude: property.longitude, source: 'pin' };
  const centre = zipCentroid(property.zip);
  return centre ? { ...centre, source: 'zip' } : null;
}

export function shopPlace(settings: StoredDayPlanSettings): LatLng | null {
  return placeOf(settings.shop);
}

/** On-site minutes of a visit or job: set-up plus the priced labour, flat-rate items at the organisation's minutes. */
export function onSiteMinutes(settings: StoredDayPlanSettings, job: { labourMinutes: number; flatItemCount: number }): number {
  return settings.setupMinutes + job.labourMinutes + job.flatItemCount * settings.flatItemMinutes;
}

export const addressOf = (p: Pick<PropertyRecord, 'street' | 'city'>) => `${p.street}, ${p.city}`;
const roundMiles = (miles: number) => Math.round(miles * 10) / 10;

/**
 * The shortest drive through the stops (exact up to 10 stops, nearest neighbour + 2-opt above), then,
 * up to 8 stops, the order that keeps the arrival windows given to the sellers best (late least, back
 * earliest, driving least): with windows open all day that is the shortest drive.
 */
function orderForDay(settings: StoredDayPlanSettings, points: LatLng[], visits: readonly PlannedVisitRecord[]): number[] {
  const km = distanceMatrix(points);
  const byDrive = orderStops(km);
  const minutesPerKm = (settings.roadFactorPercent / 100 / KM_PER_MILE / settings.averageSpeedMph) * 60;
  const stops = visits.map((v) => ({ onSiteMinutes: onSiteMinutes(settings, v), windowFrom: minutesOfDay(v.arrivalFrom), windowTo: minutesOfDay(v.arrivalTo) }));
  return orderWithinWindows(km.map((d) => d * minutesPerKm), stops, minutesOfDay(settings.dayStart), byDrive);
}

/**
 * Orders one electrician's visits of a day from and back to the shop and times them. Visits without a
 * place keep their booked order after the located ones (their drives are unknown and not counted).
 * Pure apart from the ZIP table: the caller loads the settings and visits.
 */
export function buildDayPlan(settings: StoredDayPlanSettings, electrician: { id: number; name: string }, date: string, visits: readonly PlannedVisitRecord[]): DayPlan {
  const shop = shopPlace(settings);
  const withPlace = visits.map((visit) => ({ visit, place: placeOf(visit) }));
  const located = shop ? withPlace.filter((v) => v.place) : [];
  const unlocated = withPlace.filter((v) => !located.includes(v));
  const order = shop ? orderForDay(settings, [shop, ...located.map((v) => v.place!)], located.map((v) => v.visit)) : [];
  const ordered = [...order.map((i) => located[i - 1]), ...unlocated];

  const assumptions = { roadFactorPercent: settings.roadFactorPercent, averageSpeedMph: settings.averageSpeedMph };
  const leg = (a: LatLng | null, b: LatLng | null) =>
    a && b ? { miles: roundMiles((greatCircleMiles(a, b) * settings.roadFactorPercent) / 100), minutes: driveMinutes(a, b, assumptions) } : null;
  const legs = ordered.map((stop, i) => leg(i === 0 ? shop : ordered[i - 1].place, stop.place));
  const last = ordered.at(-1);
  const back = last ? leg(last.place, shop) : null;
  const minutes = ordered.map((s) => onSiteMinutes(settings, s.visit));
  const schedule = scheduleDay(
    settings,
    ordered.map((s, i) => ({ driveMinutes: legs[i]?.minutes ?? 0, onSiteMinutes: minutes[i], arrivalFrom: s.visit.arrivalFrom, arrivalTo: s.visit.arrivalTo })),
    back?.minutes ?? 0,
  );
  const stops: DayPlanStop[] = ordered.map(({ visit, place }, i) => ({
    visitId: visit.visitId,
    requestId: visit.requestId,
    visitNumber: visit.visitNumber,
    address: addressOf(visit),
    status: visit.status,
    visitVersion: visit.version,
    arrivalFrom: visit.arrivalFrom,
    arrivalTo: visit.arrivalTo,
    place,
    itemCount: visit.itemCount,
    driveMiles: legs[i]?.miles ?? null,
    driveMinutes: legs[i]?.minutes ?? null,
    onSiteMinutes: minutes[i],
    ...schedule.stops[i],
  }));
  const totalDriveMinutes = legs.reduce((sum, l) => sum + (l?.minutes ?? 0), 0) + (back?.minutes ?? 0);
  return {
    date,
    electrician,
    dayStart: settings.dayStart,
    dayEnd: settings.dayEnd,
    leaveAt: schedule.leaveAt,
    stops,
    returnDriveMiles: back?.miles ?? null,
    returnDriveMinutes: back?.minutes ?? null,
    finish: schedule.finish,
    lunch: schedule.lunch,
    totalDriveMinutes,
    totalOnSiteMinutes: minutes.reduce((a, b) => a + b, 0),
    overflowMinutes: schedule.overflowMinutes,
    warnings: dayPlanWarnings({
      dayEnd: settings.dayEnd,
      overflowMinutes: schedule.overflowMinutes,
      isShopLocated: shop !== null,
      stops: stops.map((s) => ({ ...s, hasPlace: s.place !== null })),
    }),
    suggestions: [],
  };
}

/**
 * The day plan of one electrician of an organisation on a date (YYYY-MM-DD): the visits in driving
 * order with drive and on-site minutes and times. No authorization: the caller has checked that the
 * person asking belongs to the organisation. An electrician of another organisation gets an empty day.
 */
export async function planDay(db: Db, organisationId: number, electricianId: number, date: string): Promise<DayPlan> {
  const repository = new DayPlanRepository(db);
  const settings = await repository.settings(organisationId);
  const electrician = (await repository.electricians(organisationId)).find((e) => e.id === electricianId) ?? { id: electricianId, name: '' };
  const visits = electrician.name ? await repository.visits(organisationId, date, date, electricianId) : [];
  return buildDayPlan(settings, electrician, date, visits);
}
