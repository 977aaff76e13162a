// The trade's fixed vocabularies, shared by the database enums, the API schemas and the UI.

export const roastLevels = ['light', 'medium', 'medium-dark', 'dark', 'french'] as const;
export type RoastLevel = (typeof roastLevels)[number];
export const roastLevelLabels: Record<RoastLevel, string> = {
  light: 'Light',
  medium: 'Medium',
  'medium-dark': 'Medium-dark',
  dark: 'Dark',
  french: 'French',
};

export const processes = ['washed', 'natural', 'honey', 'wet-hulled'] as const;
export type Process = (typeof processes)[number];
export const processLabels: Record<Process, string> = {
  washed: 'Washed',
  natural: 'Natural',
  honey: 'Honey',
  'wet-hulled': 'Wet-hulled',
};

/** Bag sizes by code; green coffee and roasted coffee each sell a subset. */
export const bagSizes = ['8oz', '12oz', '1lb', '2lb', '5lb'] as const;
export type BagSize = (typeof bagSizes)[number];
export const greenBagSizes = ['8oz', '1lb', '2lb', '5lb'] as const satisfies readonly BagSize[];
export type GreenBagSize = (typeof greenBagSizes)[number];
export const roastedBagSizes = ['12oz', '1lb', '2lb'] as const satisfies readonly BagSize[];
export type RoastedBagSize = (typeof roastedBagSizes)[number];

export const brewMethods = ['filter', 'espresso'] as const;
export type BrewMethod = (typeof brewMethods)[number];

export const grinds = ['whole-bean', 'espresso', 'moka-pot', 'hand-press', 'pour-over', 'drip', 'french-press', 'cold-brew'] as const;
export type Grind = (typeof grinds)[number];
export const grindLabels: Record<Grind, string> = {
  'whole-bean': 'Whole bean',
  espresso: 'Espresso',
  'moka-pot': 'Moka pot',
  'hand-press': 'Hand press',
  'pour-over': 'Pour-over',
  drip: 'Drip machine',
  'french-press': 'French press',
  'cold-brew': 'Cold brew',
};

export const cadences = [1, 2, 3, 4] as const;
export type CadenceWeeks = (typeof cadences)[number];

/** A packer packs and ships (Pack List, shipping, reading orders); staff run the whole Roastery; the owner also the team and settings. */
export const roles = ['customer', 'packer', 'staff', 'owner'] as const;
export type Role = (typeof roles)[number];
export const roleLabels: Record<Role, string> = {
  customer: 'Customer',
  packer: 'Packer',
  staff: 'Staff',
  owner: 'Owner',
};

export const orderKinds = ['green', 'roasted'] as const;
export type OrderKind = (typeof orderKinds)[number];

export const orderStatuses = ['pending_payment', 'paid', 'held', 'roasted', 'packed', 'shipped', 'cancelled', 'refunded'] as const;
export type OrderStatus = (typeof orderStatuses)[number];

export const subscriptionStatuses = ['incomplete', 'active', 'paused', 'past_due', 'cancelled'] as const;
export type SubscriptionStatus = (typeof subscriptionStatuses)[number];

export const deliveryStatuses = ['scheduled', 'skipped', 'held', 'roasted', 'shipped'] as const;
export type DeliveryStatus = (typeof deliveryStatuses)[number];

export const homeRoastDevices = ['popper', 'stovetop-pan', 'oven', 'drum-home', 'fluid-bed-home'] as const;
export type HomeRoastDevice = (typeof homeRoastDevices)[number];
export const homeRoastDeviceLabels: Record<HomeRoastDevice, string> = {
  popper: 'Hot-air popper',
  'stovetop-pan': 'Stovetop pan',
  oven: 'Oven',
  'drum-home': 'Home drum roaster',
  'fluid-bed-home': 'Home fluid-bed roaster',
};

export const stockMovementReasons = ['arrival', 'sale', 'roast', 'sample', 'loss', 'count', 'refund'] as const;
export type StockMovementReason = (typeof stockMovementReasons)[number];

/** Days of the week by short code, Monday first (ISO 8601 order). */
export const weekdays = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;
export type Weekday = (typeof weekdays)[number];
export const weekdayLabels: Record<Weekday, string> = {
  mon: 'Monday',
  tue: 'Tuesday',
  wed: 'Wednesday',
  thu: 'Thursday',
  fri: 'Friday',
  sat: 'Saturday',
  sun: 'Sunday',
};

/** What a Roaster's Rotation line or subscription is called, since it has no lot of its own. */
export const roastersRotationName = "Roaster's Rotation";

/** When a roasted parcel ships: so it lands rested, or as soon as the degassing hold is over. */
export const shipPolicies = ['ready_on_arrival', 'after_degassing'] as const;
export type ShipPolicy = (typeof shipPolicies)[number];

/** The owner's choice, as Shop settings words it. */
export const shipPolicyLabels: Record<ShipPolicy, string> = {
  ready_on_arrival: 'Ship so it is ready to brew on arrival',
  after_degassing: 'Ship after the degassing hold, and tell the customer the ready-from date',
};

/** What the customer is told (Roasted to Order, Deliveries, order pages). */
export const shipPolicyCustomerNotes: Record<ShipPolicy, string> = {
  ready_on_arrival: 'Ready to brew on arrival: we hold each bag after roasting until it will have rested by the time it lands.',
  after_degassing: 'Ships as soon as it has degassed, so it can arrive before it is at its best: brew it from its ready-from date.',
};
