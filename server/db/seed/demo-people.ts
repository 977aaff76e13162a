// INVENTED DEMO DATA. Wrenfield Roastworks, the town of Wrenfield (Colorado), its team, its
// customers and every street address below are made up. E-mail domains are reserved test domains
// (.test), so no message can reach a real mailbox.
import type { Role } from '../../../shared/domain/vocabulary';

/** Every demo account signs in with this password (it is printed by the start script). */
export const DEMO_PASSWORD = 'restday-demo';

/** Invented shop. */
export const demoShop = {
  shopName: 'Wrenfield Roastworks',
  town: 'Wrenfield',
  state: 'CO',
  timeZone: 'America/Denver',
  /** The roastery's street address, printed on every bag label (invented: Wrenfield does not exist). */
  placeOfBusiness: { line1: '210 Foundry Row', line2: 'Unit 4', city: 'Wrenfield', region: 'CO', postalCode: '80999', country: 'US' },
} as const;

export type DemoPerson = { email: string; name: string; role: Role; joinedDaysAgo: number };

/** Invented team: one owner, two staff, one packer. */
export const demoTeam: DemoPerson[] = [
  { email: 'owner@wrenfield.test', name: 'Maren Atwood', role: 'owner', joinedDaysAgo: 720 },
  { email: 'roaster@wrenfield.test', name: 'Dario Quist', role: 'staff', joinedDaysAgo: 540 },
  { email: 'packer@wrenfield.test', name: 'Lena Porter', role: 'staff', joinedDaysAgo: 210 },
  { email: 'dispatch@wrenfield.test', name: 'Ines Varga', role: 'packer', joinedDaysAgo: 45 },
];

/** The demo customer: a home roaster who also subscribes. */
export const DEMO_CUSTOMER_EMAIL = 'homeroaster@example.test';

/** Invented customers (first and last names combined at random from common names). */
const customerNames: [string, string][] = [
  ['Marisol', 'Fenwick'],
  ['Theo', 'Brannigan'],
  ['Priya', 'Castellan'],
  ['Jonah', 'Whitlock'],
  ['Ada', 'Merriweather'],
  ['Felix', 'Hale'],
  ['Grace', 'Lindqvist'],
  ['Omar', 'Redfern'],
  ['Nora', 'Blackwood'],
  ['Sam', 'Ellery'],
  ['Lucia', 'Thornbury'],
  ['Declan', 'Pryce'],
  ['Hana', 'Kestrel'],
  ['Ivan', 'Marchetti'],
  ['Zoe', 'Calloway'],
  ['Miles', 'Ferreira'],
  ['Yuki', 'Ashdown'],
  ['Eliza', 'Graves'],
  ['Tomas', 'Birchall'],
  ['Amara', 'Quill'],
  ['Ben', 'Holloway'],
  ['Rosa', 'Delacroix'],
  ['Kit', 'Sommers'],
  ['June', 'Harrow'],
];

export const demoCustomers: DemoPerson[] = [
  { email: DEMO_CUSTOMER_EMAIL, name: 'Robin Alder', role: 'customer', joinedDaysAgo: 150 },
  ...customerNames.map(([first, last], i) => ({
    email: `${first.toLowerCase()}.${last.toLowerCase()}@example.test`,
    name: `${first} ${last}`,
    role: 'customer' as const,
    joinedDaysAgo: 40 + ((i * 37) % 380),
  })),
];

/** Invented towns (state codes are real, the towns and ZIP-shaped codes are not). */
export const demoTowns: { city: string; region: string; postalPrefix: string }[] = [
  { city: 'Wrenfield', region: 'CO', postalPrefix: '816' },
  { city: 'Cinder Hollow', region: 'CO', postalPrefix: '815' },
  { city: 'Larch Bend', region: 'MT', postalPrefix: '597' },
  { city: 'Port Ellory', region: 'OR', postalPrefix: '973' },
  { city: 'Maple Crossing', region: 'VT', postalPrefix: '050' },
  { city: 'South Amberley', region: 'NC', postalPrefix: '287' },
  { city: 'Kettle Flats', region: 'MN', postalPrefix: '565' },
  { city: 'Sawyer Springs', region: 'TX', postalPrefix: '786' },
  { city: 'Greyhaven', region: 'WA', postalPrefix: '982' },
  { city: 'Oriel Park', region: 'IL', postalPrefix: '606' },
];

/** Invented street names. */
export const demoStreets = [
  'Larkspur Lane',
  'Quarry Road',
  'Juniper Street',
  'Old Mill Way',
  'Hawthorn Avenue',
  'Canal Street',
  'Bellflower Court',
  'Ridgeview Drive',
  'Tanager Place',
  'Coldwater Road',
  'Foundry Row',
  'Sycamore Terrace',
];
