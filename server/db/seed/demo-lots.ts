// INVENTED DEMO DATA. Every farm, producer, cooperative, washing station, mill and shop named here
// is made up for the demo scenario; only the countries and growing regions are real places. Numbers
// (altitude, moisture, density, screen size, cupping score) are plausible values, not measurements.
import type { Process, RoastLevel } from '../../../shared/domain/vocabulary';

export type DemoLot = {
  code: string;
  name: string;
  origin: string;
  region: string;
  producer: string;
  variety: string;
  process: Process;
  altitudeM: number;
  cropYear: number;
  moisturePct: number;
  densityGPerL: number;
  screenSize: string;
  cuppingScore: number;
  tastingNotes: string[];
  description: string;
  suggestedLevel: RoastLevel;
  allowedLevels: RoastLevel[];
  /** Green grams on hand once the demo history has played out. */
  stockGrams: number;
  pricePerKgCents: number;
  /** Quantity breaks: [minGrams, pricePerKgCents]. 2268 g = 5 lb, 9072 g = 20 lb, 22680 g = 50 lb. */
  priceBreaks: [number, number][];
  /** Days before `now` the lot arrived. */
  arrivedDaysAgo: number;
  /** May staff pick it for Roaster's Rotation in the demo? */
  rotation: boolean;
};

/** Ten invented green lots (invented producers; real origins). */
export const demoLots: DemoLot[] = [
  {
    // Invented lot: producer and washing station are fictional.
    code: 'WR-24-ETH-01',
    name: 'Keraba Ridge',
    origin: 'Ethiopia',
    region: 'Sidama',
    producer: 'Keraba Ridge washing station smallholders (invented)',
    variety: 'Ethiopian landrace (74110, 74112)',
    process: 'washed',
    altitudeM: 2050,
    cropYear: 2024,
    moisturePct: 10.4,
    densityGPerL: 742,
    screenSize: '14/16',
    cuppingScore: 88.25,
    tastingNotes: ['jasmine', 'bergamot', 'white peach'],
    description:
      'Delivered in cherry by a few hundred smallholder families to the Keraba Ridge station, fermented overnight and washed in channels before two weeks on raised beds. Dense, small beans that take heat slowly: give the drying phase time and stop early to keep the florals.',
    suggestedLevel: 'light',
    allowedLevels: ['light', 'medium'],
    stockGrams: 38_200,
    pricePerKgCents: 2950,
    priceBreaks: [
      [2268, 2720],
      [9072, 2500],
    ],
    arrivedDaysAgo: 96,
    rotation: false,
  },
  {
    // Invented lot: the outgrowers' group is fictional.
    code: 'WR-24-ETH-02',
    name: 'Ledo Barsa Natural',
    origin: 'Ethiopia',
    region: 'Guji',
    producer: 'Ledo Barsa outgrowers (invented)',
    variety: 'Ethiopian landrace',
    process: 'natural',
    altitudeM: 2150,
    cropYear: 2024,
    moisturePct: 9.8,
    densityGPerL: 721,
    screenSize: '14/16',
    cuppingScore: 87.5,
    tastingNotes: ['blueberry', 'strawberry jam', 'dark chocolate'],
    description:
      'Whole cherries dried slowly on raised beds for about four weeks under shade netting. Loud fruit in the cup; naturals throw more chaff and can scorch at the tips, so keep the beans moving and clear the chaff collector between batches.',
    suggestedLevel: 'light',
    allowedLevels: ['light', 'medium', 'medium-dark'],
    stockGrams: 21_600,
    pricePerKgCents: 3150,
    priceBreaks: [
      [2268, 2900],
      [9072, 2680],
    ],
    arrivedDaysAgo: 88,
    rotation: false,
  },
  {
    // Invented farm and family.
    code: 'WR-24-COL-01',
    name: 'Alto del Colibrí Gris',
    origin: 'Colombia',
    region: 'Huila',
    producer: 'Ossa Ramírez family, Finca Alto del Colibrí Gris (invented)',
    variety: 'Caturra, Castillo',
    process: 'washed',
    altitudeM: 1750,
    cropYear: 2024,
    moisturePct: 11.1,
    densityGPerL: 705,
    screenSize: '15/17',
    cuppingScore: 86.0,
    tastingNotes: ['red apple', 'panela', 'milk chocolate'],
    description:
      'A family farm on a steep slope above a river valley, picking ripe cherry in several passes and washing it on the farm. Sweet and forgiving from light to dark; our house pick for Roaster\u2019s Rotation when it is in season.',
    suggestedLevel: 'medium',
    allowedLevels: ['light', 'medium', 'medium-dark', 'dark'],
    stockGrams: 54_300,
    pricePerKgCents: 2350,
    priceBreaks: [
      [2268, 2160],
      [9072, 1990],
      [22680, 1880],
    ],
    arrivedDaysAgo: 74,
    rotation: true,
  },
  {
    // Invented farm.
    code: 'WR-24-GTM-01',
    name: 'Piedra Azulada',
    origin: 'Guatemala',
    region: 'Huehuetenango',
    producer: 'Finca Piedra Azulada (invented)',
    variety: 'Bourbon, Caturra',
    process: 'washed',
    altitudeM: 1900,
    cropYear: 2024,
    moisturePct: 10.6,
    densityGPerL: 728,
    screenSize: '16/18',
    cuppingScore: 86.5,
    tastingNotes: ['cocoa nib', 'orange', 'brown sugar'],
    description:
      'Grown under shade on limestone soil and dried on patios, then rested in parchment before milling. Balanced and round; a good first lot for a new popper because first crack is loud and easy to hear.',
    suggestedLevel: 'medium',
    allowedLevels: ['light', 'medium', 'medium-dark', 'dark'],
    stockGrams: 46_100,
    pricePerKgCents: 2400,
    priceBreaks: [
      [2268, 2210],
      [9072, 2040],
      [22680, 1920],
    ],
    arrivedDaysAgo: 81,
    rotation: true,
  },
  {
    // Invented estate.
    code: 'WR-24-BRA-01',
    name: 'Fazenda Três Pinhas',
    origin: 'Brazil',
    region: 'Sul de Minas',
    producer: 'Fazenda Três Pinhas (invented)',
    variety: 'Yellow Catuaí',
    process: 'natural',
    altitudeM: 1200,
    cropYear: 2024,
    moisturePct: 11.4,
    densityGPerL: 668,
    screenSize: '17/18',
    cuppingScore: 84.0,
    tastingNotes: ['peanut', 'milk chocolate', 'caramel'],
    description:
      'Mechanically harvested, sorted and dried on patios and in drum dryers. Low density, so it roasts fast and browns early: lower the heat before first crack. Our espresso workhorse.',
    suggestedLevel: 'medium-dark',
    allowedLevels: ['medium', 'medium-dark', 'dark', 'french'],
    stockGrams: 71_800,
    pricePerKgCents: 1800,
    priceBreaks: [
      [2268, 1650],
      [9072, 1530],
      [22680, 1440],
    ],
    arrivedDaysAgo: 110,
    rotation: false,
  },
  {
    // Invented factory (washing station) name. Sold out in the demo.
    code: 'WR-24-KEN-01',
    name: 'Githiru AA',
    origin: 'Kenya',
    region: 'Nyeri',
    producer: 'Githiru Farmers\u2019 Factory members (invented)',
    variety: 'SL28, SL34',
    process: 'washed',
    altitudeM: 1850,
    cropYear: 2024,
    moisturePct: 10.2,
    densityGPerL: 748,
    screenSize: 'AA (17/18)',
    cuppingScore: 88.75,
    tastingNotes: ['blackcurrant', 'grapefruit', 'tomato leaf'],
    description:
      'Double-fermented and soaked before drying on raised tables. Bright, juicy and very dense; it wants a long, gentle drying phase. Sold out for this season: we will list the next arrival here.',
    suggestedLevel: 'light',
    allowedLevels: ['light', 'medium'],
    stockGrams: 0,
    pricePerKgCents: 3200,
    priceBreaks: [
      [2268, 2950],
      [9072, 2720],
    ],
    arrivedDaysAgo: 120,
    rotation: false,
  },
  {
    // Invented micro-mill. Low stock in the demo.
    code: 'WR-24-CRI-01',
    name: 'Quebrada Lucero Honey',
    origin: 'Costa Rica',
    region: 'Tarrazú',
    producer: 'Micro-beneficio Quebrada Lucero (invented)',
    variety: 'Catuaí, Caturra',
    process: 'honey',
    altitudeM: 1650,
    cropYear: 2024,
    moisturePct: 10.8,
    densityGPerL: 712,
    screenSize: '16/18',
    cuppingScore: 85.75,
    tastingNotes: ['honeydew', 'cane sugar', 'toasted almond'],
    description:
      'Yellow honey: pulped, then dried with some of the sticky mucilage left on for about two weeks on raised beds. Sweet and syrupy; the sugars brown quickly, so watch the colour after yellowing.',
    suggestedLevel: 'medium',
    allowedLevels: ['light', 'medium', 'medium-dark'],
    stockGrams: 1_800,
    pricePerKgCents: 2600,
    priceBreaks: [
      [2268, 2390],
      [9072, 2210],
    ],
    arrivedDaysAgo: 102,
    rotation: false,
  },
  {
    // Invented cooperative.
    code: 'WR-24-SUM-01',
    name: 'Bener Ulu Wet-hulled',
    origin: 'Indonesia',
    region: 'Aceh (Gayo highlands)',
    producer: 'Bener Ulu growers\u2019 cooperative (invented)',
    variety: 'Ateng, Tim Tim',
    process: 'wet-hulled',
    altitudeM: 1550,
    cropYear: 2024,
    moisturePct: 11.8,
    densityGPerL: 655,
    screenSize: '18+',
    cuppingScore: 84.5,
    tastingNotes: ['cedar', 'dark cocoa', 'molasses'],
    description:
      'Hulled while still wet and finished drying as green bean, which gives the blue-green colour and the heavy, earthy body. Takes dark roasts well; expect more smoke, so ventilate.',
    suggestedLevel: 'dark',
    allowedLevels: ['medium-dark', 'dark', 'french'],
    stockGrams: 30_900,
    pricePerKgCents: 2050,
    priceBreaks: [
      [2268, 1890],
      [9072, 1740],
    ],
    arrivedDaysAgo: 67,
    rotation: false,
  },
  {
    // Invented cooperative.
    code: 'WR-25-PER-01',
    name: 'Flor de Cumbre',
    origin: 'Peru',
    region: 'Cajamarca',
    producer: 'Cooperativa Flor de Cumbre (invented)',
    variety: 'Typica, Bourbon, Caturra',
    process: 'washed',
    altitudeM: 1800,
    cropYear: 2025,
    moisturePct: 10.9,
    densityGPerL: 718,
    screenSize: '15/17',
    cuppingScore: 85.25,
    tastingNotes: ['plum', 'walnut', 'cocoa'],
    description:
      'Small plots of old Typica and Bourbon, washed at home and sold through the cooperative. Gentle acidity and a nutty finish; comfortable anywhere from light to dark.',
    suggestedLevel: 'medium',
    allowedLevels: ['light', 'medium', 'medium-dark', 'dark'],
    stockGrams: 26_400,
    pricePerKgCents: 2150,
    priceBreaks: [
      [2268, 1980],
      [9072, 1830],
    ],
    arrivedDaysAgo: 39,
    rotation: true,
  },
  {
    // Invented washing station.
    code: 'WR-25-RWA-01',
    name: 'Nyakigezi Red Bourbon',
    origin: 'Rwanda',
    region: 'Western Province',
    producer: 'Nyakigezi washing station (invented)',
    variety: 'Red Bourbon',
    process: 'washed',
    altitudeM: 1900,
    cropYear: 2025,
    moisturePct: 10.5,
    densityGPerL: 735,
    screenSize: '15/17',
    cuppingScore: 87.0,
    tastingNotes: ['raspberry', 'hibiscus', 'black tea'],
    description:
      'Cherry is floated and hand-sorted before pulping, fermented dry, then washed and dried on raised beds by the lake. Hand-sort the green before roasting: like many lots from the region, a stray bean can carry a potato-like taint.',
    suggestedLevel: 'light',
    allowedLevels: ['light', 'medium', 'medium-dark'],
    stockGrams: 13_900,
    pricePerKgCents: 2850,
    priceBreaks: [
      [2268, 2620],
      [9072, 2420],
    ],
    arrivedDaysAgo: 31,
    rotation: false,
  },
];
