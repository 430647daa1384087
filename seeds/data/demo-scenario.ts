// The demo scenario: Marlow Springs, Colorado, a fictional mountain town, and the people who
// buy, sell, inspect and repair its houses. Everything here is invented for the demo.
import { requestPathTo, type FindingCode, type RequestEvent, type RequestStatus, type Room, type Severity } from '@cc/shared';

export const DEMO_PASSWORD = 'marlow-springs-demo';

export const ORGANISATIONS = [
  { key: 'juniper', name: 'Juniper Key Realty', kind: 'brokerage', phone: '(719) 555-0141', address: '12 Aspen Row, Marlow Springs, CO 80903' },
  { key: 'tallgrass', name: 'Tallgrass Home Partners', kind: 'brokerage', phone: '(719) 555-0178', address: '480 Mill Street, Marlow Springs, CO 80903' },
  {
    key: 'brightline', name: 'Brightline Electric Co.', kind: 'contractor', phone: '(719) 555-0123', address: '77 Foundry Lane, Marlow Springs, CO 80903',
    licenceNumber: 'EC-0048215', licenceState: 'CO', licenceClass: 'Electrical contractor (master on staff)',
  },
  {
    key: 'copperleaf', name: 'Copperleaf Electrical Services', kind: 'contractor', phone: '(719) 555-0190', address: '3 Quarry Bend Road, Quarry Bend, CO 80817',
    licenceNumber: 'EC-0051907', licenceState: 'CO', licenceClass: 'Electrical contractor',
  },
  { key: 'keystone', name: 'Keystone Lens Home Inspections', kind: 'inspection-company', phone: '(719) 555-0166', address: '9 Ridgeview Court, Marlow Springs, CO 80903' },
  { key: 'platform', name: 'Closing Circuit', kind: 'platform', phone: null, address: null },
] as const;

export type OrganisationKey = (typeof ORGANISATIONS)[number]['key'];

export const PEOPLE = [
  { key: 'admin', email: 'admin@closingcircuit.test', name: 'Dana Whitfield', role: 'admin', org: 'platform' },
  { key: 'maya', email: 'maya.chen@juniperkey.test', name: 'Maya Chen', role: 'agent', org: 'juniper' },
  { key: 'rob', email: 'rob.hale@tallgrass.test', name: 'Robert Hale', role: 'agent', org: 'tallgrass' },
  { key: 'priya', email: 'priya.natarajan@tallgrass.test', name: 'Priya Natarajan', role: 'agent', org: 'tallgrass' },
  { key: 'ellen', email: 'ellen.brooks@mail.test', name: 'Ellen Brooks', role: 'seller', org: null },
  { key: 'tomas', email: 'tomas.garza@mail.test', name: 'Tomás Garza', role: 'seller', org: null },
  { key: 'june', email: 'june.albright@mail.test', name: 'June Albright', role: 'seller', org: null },
  { key: 'sam', email: 'sam.okafor@brightline.test', name: 'Sam Okafor', role: 'contractor', org: 'brightline' },
  { key: 'lee', email: 'lee.park@brightline.test', name: 'Lee Park', role: 'contractor', org: 'brightline' },
  { key: 'jo', email: 'jo.fenn@copperleaf.test', name: 'Jo Fenn', role: 'contractor', org: 'copperleaf' },
  { key: 'nora', email: 'nora.vance@keystonelens.test', name: 'Nora Vance', role: 'inspector', org: 'keystone' },
] as const;

export type PersonKey = (typeof PEOPLE)[number]['key'];

interface DemoItem {
  code: FindingCode;
  room: Room;
  location: string;
  quantity: number | null;
  severity: Severity;
  necRefs: string[];
}

export interface DemoRequest {
  street: string;
  city: string;
  zip: string;
  yearBuilt: number;
  /** Days from the seeding day to closing (negative: closed already). */
  closingInDays: number;
  necEdition: 2017 | 2020 | 2023;
  /** The moves the request made (events of the flow table), from its opening to where it is now. */
  path: RequestEvent[];
  buyerAgent: PersonKey;
  listingAgent: PersonKey | null;
  seller: PersonKey | null;
  /** A seller invited by e-mail who has not made an account yet. */
  invitedSellerEmail?: string;
  inspector: PersonKey | null;
  contractor: OrganisationKey | null;
  items: DemoItem[];
  /**
   * Where the proof of the work takes a request that the path left `scheduled`: seeds/06_proof.ts
   * records each item's correction (readings, photo) through the corrections service, then issues the
   * completion letter and has it accepted through the letters service, as the people would.
   */
  proof?: 'corrected' | 'letter-issued' | 'accepted';
}

const gfciKitchen: DemoItem = { code: 'gfci-missing', room: 'kitchen', location: 'kitchen counter right of range', quantity: 2, severity: 'safety', necRefs: ['210.8(A)', '406.4(D)(3)'] };
const gfciBath: DemoItem = { code: 'gfci-missing', room: 'bathroom', location: 'hall bathroom vanity', quantity: 1, severity: 'safety', necRefs: ['210.8(A)', '406.4(D)(3)'] };
const polarity: DemoItem = { code: 'reversed-polarity', room: 'bedroom', location: 'northeast bedroom, east wall', quantity: 1, severity: 'safety', necRefs: ['200.11', '406.4'] };
const openGround: DemoItem = { code: 'open-ground', room: 'living-area', location: 'living room, three-slot receptacles', quantity: 3, severity: 'safety', necRefs: ['406.4(D)(2)', '250.146'] };
const doubleTap: DemoItem = { code: 'double-tap', room: 'panel', location: 'main panel, breaker 14', quantity: 1, severity: 'repair', necRefs: ['110.14', '408.41'] };
const weatherCover: DemoItem = { code: 'weather-cover-missing', room: 'exterior', location: 'rear patio', quantity: 1, severity: 'repair', necRefs: ['406.9'] };
const smoke: DemoItem = { code: 'smoke-co-alarm', room: 'hallway', location: 'upstairs hallway', quantity: 1, severity: 'safety', necRefs: ['NFPA 72', 'local code'] };
const junction: DemoItem = { code: 'open-junction-box', room: 'attic', location: 'attic above garage', quantity: 2, severity: 'safety', necRefs: ['314.28(C)', '300.15'] };

/** The usual course of moves that brings a request to `status` (the flow table's path). */
const upTo = (status: RequestStatus): RequestEvent[] => requestPathTo(status).map((m) => m.event);

export const REQUESTS: DemoRequest[] = [
  { street: '214 Larkspur Lane', city: 'Marlow Springs', zip: '80903', yearBuilt: 1987, closingInDays: 24, necEdition: 2023, path: upTo('draft'), buyerAgent: 'maya', listingAgent: null, seller: null, invitedSellerEmail: 'walt.simms@mail.test', inspector: null, contractor: null, items: [] },
  { street: '9 Foundry Court', city: 'Marlow Springs', zip: '80903', yearBuilt: 1962, closingInDays: 19, necEdition: 2023, path: upTo('intake'), buyerAgent: 'maya', listingAgent: 'rob', seller: 'ellen', inspector: 'nora', contractor: 'brightline', items: [] },
  { street: '1180 Ridgeview Drive', city: 'Marlow Springs', zip: '80903', yearBuilt: 2004, closingInDays: 16, necEdition: 2023, path: upTo('pricing'), buyerAgent: 'maya', listingAgent: 'rob', seller: 'tomas', inspector: 'nora', contractor: 'brightline', items: [gfciKitchen, gfciBath, weatherCover, doubleTap] },
  { street: '56 Quarry Bend Road', city: 'Quarry Bend', zip: '80817', yearBuilt: 1948, closingInDays: 12, necEdition: 2020, path: upTo('pricing'), buyerAgent: 'priya', listingAgent: null, seller: 'june', inspector: 'nora', contractor: 'copperleaf', items: [openGround, polarity, junction] },
  { street: '702 Aspen Row', city: 'Marlow Springs', zip: '80903', yearBuilt: 1975, closingInDays: 14, necEdition: 2023, path: upTo('quoted'), buyerAgent: 'maya', listingAgent: 'rob', seller: 'ellen', inspector: 'nora', contractor: 'brightline', items: [gfciBath, polarity, smoke] },
  { street: '33 Mill Street', city: 'Marlow Springs', zip: '80903', yearBuilt: 1958, closingInDays: 9, necEdition: 2023, path: upTo('approved'), buyerAgent: 'priya', listingAgent: 'rob', seller: 'tomas', inspector: 'nora', contractor: 'brightline', items: [openGround, doubleTap] },
  { street: '418 Wren Hollow', city: 'Marlow Springs', zip: '80903', yearBuilt: 1991, closingInDays: 6, necEdition: 2023, path: upTo('scheduled'), buyerAgent: 'maya', listingAgent: null, seller: 'june', inspector: 'nora', contractor: 'brightline', items: [gfciKitchen, weatherCover] },
  { street: '87 Tinsmith Way', city: 'Marlow Springs', zip: '80903', yearBuilt: 1969, closingInDays: 4, necEdition: 2023, path: upTo('in-progress'), buyerAgent: 'maya', listingAgent: 'rob', seller: 'ellen', inspector: 'nora', contractor: 'brightline', items: [gfciBath, junction, smoke] },
  { street: '1502 Sawmill Ridge', city: 'Quarry Bend', zip: '80817', yearBuilt: 2011, closingInDays: 3, necEdition: 2020, path: upTo('scheduled'), proof: 'corrected', buyerAgent: 'priya', listingAgent: 'rob', seller: 'tomas', inspector: 'nora', contractor: 'brightline', items: [weatherCover] },
  { street: '25 Lantern Square', city: 'Marlow Springs', zip: '80903', yearBuilt: 1999, closingInDays: 2, necEdition: 2023, path: upTo('scheduled'), proof: 'letter-issued', buyerAgent: 'maya', listingAgent: 'rob', seller: 'june', inspector: 'nora', contractor: 'brightline', items: [doubleTap, gfciKitchen] },
  { street: '640 Bellweather Road', city: 'Marlow Springs', zip: '80903', yearBuilt: 1983, closingInDays: 0, necEdition: 2023, path: upTo('scheduled'), proof: 'accepted', buyerAgent: 'maya', listingAgent: null, seller: 'ellen', inspector: 'nora', contractor: 'brightline', items: [polarity] },
  { street: '12 Cobble Creek Lane', city: 'Marlow Springs', zip: '80903', yearBuilt: 1955, closingInDays: 30, necEdition: 2023, path: upTo('declined'), buyerAgent: 'priya', listingAgent: 'rob', seller: 'june', inspector: 'nora', contractor: 'brightline', items: [openGround] },
  { street: '301 Kestrel Point', city: 'Quarry Bend', zip: '80817', yearBuilt: 1979, closingInDays: 21, necEdition: 2020, path: [...upTo('intake'), 'withdraw'], buyerAgent: 'maya', listingAgent: null, seller: 'tomas', inspector: 'nora', contractor: 'copperleaf', items: [] },
  // Brightline's planned day (seeds/05_day_plan.ts books their visits for Sam Okafor on the next
  // weekday) and approved jobs nearby still waiting for a visit. Real ZIP codes of the ZIP-code list,
  // so the day plan can place them; the town, streets and people stay invented.
  ...plannedDayRequests(),
];

/** The shop every Brightline day starts and ends at (its ZIP code is in the ZIP-code list). */
export const BRIGHTLINE_SHOP = { street: '77 Foundry Lane', city: 'Marlow Springs', state: 'CO', zip: '80903' } as const;

/** Streets of the seeded planned day, with the arrival window each visit was booked with. */
export const PLANNED_DAY_VISITS = [
  { street: '16 Chapel Row', arrivalFrom: '08:00', arrivalTo: '10:00' },
  { street: '405 Orchard Bend', arrivalFrom: '09:30', arrivalTo: '11:30' },
  { street: '92 Millrace Court', arrivalFrom: '12:30', arrivalTo: '14:30' },
  { street: '2210 Kiln Street', arrivalFrom: '13:30', arrivalTo: '15:30' },
] as const;

function plannedDayRequests(): DemoRequest[] {
  const base = { city: 'Marlow Springs', necEdition: 2023, buyerAgent: 'maya', listingAgent: 'rob', inspector: 'nora', contractor: 'brightline' } as const;
  return [
    { ...base, street: '16 Chapel Row', zip: '80903', yearBuilt: 1972, closingInDays: 8, path: upTo('scheduled'), seller: 'ellen', items: [gfciKitchen] },
    { ...base, street: '405 Orchard Bend', zip: '80905', yearBuilt: 1964, closingInDays: 10, path: upTo('scheduled'), seller: 'tomas', items: [doubleTap, weatherCover] },
    { ...base, street: '92 Millrace Court', zip: '80909', yearBuilt: 1988, closingInDays: 9, path: upTo('scheduled'), seller: 'june', items: [polarity] },
    { ...base, street: '2210 Kiln Street', zip: '80907', yearBuilt: 1957, closingInDays: 11, path: upTo('scheduled'), seller: 'ellen', items: [smoke, gfciBath] },
    { ...base, street: '58 Weaver Lane', zip: '80904', yearBuilt: 1981, closingInDays: 12, path: upTo('approved'), seller: 'tomas', items: [gfciBath] },
    { ...base, street: '7 Tannery Close', zip: '80910', yearBuilt: 1969, closingInDays: 13, path: upTo('approved'), seller: 'june', items: [weatherCover] },
    { ...base, street: '311 Spindle Way', zip: '80906', yearBuilt: 1993, closingInDays: 15, path: upTo('approved'), seller: 'ellen', items: [doubleTap] },
    { ...base, street: '140 Cooper Hill', zip: '80916', yearBuilt: 1976, closingInDays: 16, path: upTo('approved'), seller: 'tomas', items: [polarity] },
  ];
}

/** Lee Park's planned day of two visits (booked by seeds/05_site_visits.ts on the next weekday). */
export const DEMO_PLANNED_DAY = {
  electricianEmail: 'lee.park@brightline.test',
  stops: [
    { street: '418 Wren Hollow', arrivalFrom: '08:00', arrivalTo: '09:00', accessNotes: 'Seller home until 9; side gate unlocked' },
    { street: '87 Tinsmith Way', arrivalFrom: '10:00', arrivalTo: '11:30', accessNotes: 'Lockbox on the garage door, code 5180' },
  ],
};
