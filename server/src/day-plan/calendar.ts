import { createEvents, type EventAttributes } from 'ics';
import { instantOf, requestReference } from '@cc/shared';
import type { CalendarVisitRecord } from './day-plan.repository';
import { addressOf, placeOf } from './plan-day';

// Calendar files (RFC 5545) of site visits, made with the `ics` package. Times are the arrival
// window as booked, on the wall clock of the organisation's time zone, written in UTC (RFC 5545
// §3.3.5, form 2), so every calendar shows them at the right hour wherever it is. Access notes are
// never written: a calendar feed travels further than the portal. A cancelled visit stays in the feed
// as a cancelled event (STATUS:CANCELLED, RFC 5545 §3.8.1.11) so that a calendar that had it drops it;
// SEQUENCE (§3.8.7.4) is the visit's version, which grows with every move, start and cancellation.

const PRODUCT_ID = '-//Closing Circuit//Day plan//EN';

/** The UTC date-time of `clock` on `date` in `zone`, as the ics package takes it. */
function dateTime(zone: string, date: string, clock: string): [number, number, number, number, number] {
  const at = instantOf(zone, date, clock);
  return [at.getUTCFullYear(), at.getUTCMonth() + 1, at.getUTCDate(), at.getUTCHours(), at.getUTCMinutes()];
}

function eventOf(visit: CalendarVisitRecord, electricianName: string, zone: string): EventAttributes {
  const place = placeOf(visit);
  const isCancelled = visit.status === 'cancelled';
  const what = isCancelled ? 'Cancelled: nobody goes.' : `${visit.itemCount} item${visit.itemCount === 1 ? '' : 's'} to correct.`;
  return {
    uid: `site-visit-${visit.visitId}@closing-circuit`,
    productId: PRODUCT_ID,
    sequence: visit.version,
    title: `${isCancelled ? 'Cancelled: site visit' : 'Site visit'} ${visit.visitNumber}: ${addressOf(visit)}`,
    description: `Arrival window ${visit.arrivalFrom}–${visit.arrivalTo} (${electricianName}). ${what} Request ${requestReference(visit.requestId)}.`,
    location: `${visit.street}, ${visit.city}, ${visit.state} ${visit.zip}`,
    ...(place ? { geo: { lat: place.latitude, lon: place.longitude } } : {}),
    start: dateTime(zone, visit.date, visit.arrivalFrom),
    startInputType: 'utc',
    startOutputType: 'utc',
    end: dateTime(zone, visit.date, visit.arrivalTo),
    endInputType: 'utc',
    endOutputType: 'utc',
    status: isCancelled ? 'CANCELLED' : 'CONFIRMED',
    busyStatus: isCancelled ? 'FREE' : 'BUSY',
    transp: isCancelled ? 'TRANSPARENT' : 'OPAQUE',
  };
}

/** A calendar of `visits` (one event each), booked in `zone`; `name` titles a subscribed feed. */
export function visitsCalendar(visits: readonly CalendarVisitRecord[], electricianName: (id: number) => string, zone: string, name?: string): string {
  const { error, value } = createEvents(
    visits.map((v) => eventOf(v, electricianName(v.electricianId), zone)),
    name ? { calName: name, productId: PRODUCT_ID } : { productId: PRODUCT_ID },
  );
  if (error || !value) throw error ?? new Error('The calendar could not be written');
  return value;
}
