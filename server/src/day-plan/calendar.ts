import { createEvents, type EventAttributes } from 'ics';
import { requestReference } from '@cc/shared';
import type { PlannedVisitRecord } from './day-plan.repository';
import { addressOf, placeOf } from './plan-day';

// Calendar files (RFC 5545) of site visits, made with the `ics` package. Times are the arrival
// window as booked, written as floating local times (the contractor's own time of day). Access notes
// are never written: a calendar feed travels further than the portal.

const PRODUCT_ID = '-//Closing Circuit//Day plan//EN';

function dateTime(date: string, clock: string): [number, number, number, number, number] {
  const [y, m, d] = date.split('-').map(Number);
  const [h, min] = clock.split(':').map(Number);
  return [y, m, d, h, min];
}

function eventOf(visit: PlannedVisitRecord, electricianName: string): EventAttributes {
  const place = placeOf(visit);
  return {
    uid: `site-visit-${visit.visitId}@closing-circuit`,
    productId: PRODUCT_ID,
    title: `Site visit ${visit.visitNumber}: ${addressOf(visit)}`,
    description: `Arrival window ${visit.arrivalFrom}–${visit.arrivalTo} (${electricianName}). ${visit.itemCount} item${visit.itemCount === 1 ? '' : 's'} to correct. Request ${requestReference(visit.requestId)}.`,
    location: `${visit.street}, ${visit.city}, ${visit.state} ${visit.zip}`,
    ...(place ? { geo: { lat: place.latitude, lon: place.longitude } } : {}),
    start: dateTime(visit.date, visit.arrivalFrom),
    startInputType: 'local',
    startOutputType: 'local',
    end: dateTime(visit.date, visit.arrivalTo),
    endInputType: 'local',
    endOutputType: 'local',
    status: 'CONFIRMED',
    busyStatus: 'BUSY',
  };
}

/** A calendar of `visits` (one event each); `name` titles a subscribed feed. */
export function visitsCalendar(visits: readonly PlannedVisitRecord[], electricianName: (id: number) => string, name?: string): string {
  const { error, value } = createEvents(
    visits.map((v) => eventOf(v, electricianName(v.electricianId))),
    name ? { calName: name, productId: PRODUCT_ID } : { productId: PRODUCT_ID },
  );
  if (error || !value) throw error ?? new Error('The calendar could not be written');
  return value;
}
