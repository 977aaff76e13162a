/**
 * The Home Roast Guide: how to take a lot to a roast level on a home device.
 *
 * - `homeRoastProfiles`: devices with values Restday can stand behind. Only the hot-air popper
 *   has them (common practice); other home devices vary too much to print numbers.
 * - `roastGuideDevices`, `isRoastGuideDevice(name)`: the devices a guide can be asked for.
 * - `homeRoastGuide(request, lossModel)`: batches for a green weight, expected roasted grams as a
 *   range, phases with their cues, time after first crack for the level (and every level, the
 *   lot's suggestion marked), and the safety cautions. Shape of `GET /api/lots/:code/roast-guide`.
 * - `homeRoastCautions`: the cautions shown wherever a person reads the guide.
 */
import { ceilDiv } from './integer-math';
import { roastedYieldRange, type LossModel } from './roast-loss';
import { roastLevels, type HomeRoastDevice, type RoastLevel } from './vocabulary';

export interface HomeRoastProfile {
  device: HomeRoastDevice;
  name: string;
  batchGrams: { min: number; max: number };
  /** Roughly when first crack starts. */
  firstCrackSeconds: number;
  afterFirstCrackSeconds: Record<RoastLevel, { min: number; max: number }>;
  source: string;
}

/** Hot-air popper values for home roasting (common practice). */
const popper: HomeRoastProfile = {
  device: 'popper',
  name: 'Hot-air popcorn popper',
  batchGrams: { min: 75, max: 80 },
  firstCrackSeconds: 180,
  afterFirstCrackSeconds: {
    light: { min: 5, max: 10 },
    medium: { min: 20, max: 30 },
    'medium-dark': { min: 30, max: 40 },
    dark: { min: 60, max: 60 },
    french: { min: 90, max: 90 },
  },
  source: 'common practice',
};

export const homeRoastProfiles: Partial<Record<HomeRoastDevice, HomeRoastProfile>> = { popper };
export const roastGuideDevices = Object.keys(homeRoastProfiles) as HomeRoastDevice[];

export function isRoastGuideDevice(name: string): name is HomeRoastDevice {
  return Object.hasOwn(homeRoastProfiles, name);
}

export const homeRoastCautions: readonly string[] = [
  'Never leave the roaster unattended while it runs.',
  'Roast with ventilation: open a window or run the range hood. Smoke can set off alarms.',
  'Chaff is flammable: catch it, and clear it after every batch.',
  'The device, the beans and the chaff are hot. Use an oven mitt.',
  'Cool the beans at once (a colander and moving air) or they keep roasting.',
  "A popcorn popper used for coffee is used outside its maker's intended purpose.",
  'These are general cautions, not safety advice for your device or home; follow local codes.',
];

export interface RoastPhase {
  name: string;
  cue: string;
}

function phasesFor(profile: HomeRoastProfile, level: RoastLevel): RoastPhase[] {
  const afterCrack = profile.afterFirstCrackSeconds[level];
  const afterCrackText = afterCrack.min === afterCrack.max ? `about ${afterCrack.min} s` : `${afterCrack.min}–${afterCrack.max} s`;
  const phases: RoastPhase[] = [
    { name: 'Drying', cue: 'The beans turn from green to pale yellow and smell of cut grass or hay.' },
    {
      name: 'Browning',
      cue: 'Yellow deepens to tan and light brown; the smell turns bread-like and the chaff starts to lift.',
    },
    {
      name: 'First crack',
      cue: `Audible cracks, like quiet popcorn, about ${Math.round(profile.firstCrackSeconds / 60)} min in. Start timing.`,
    },
    {
      name: 'Development',
      cue: `Keep going ${afterCrackText} after first crack for a ${level === 'french' ? 'French' : level} roast; judge the colour by eye as well.`,
    },
  ];
  if (level === 'dark' || level === 'french') {
    phases.push({
      name: 'Second crack',
      cue: 'Faster, sharper snaps; oil shows on the beans and the smoke thickens. Stop soon after it starts.',
    });
  }
  phases.push({
    name: 'Cooling',
    cue: 'Tip the beans into a colander and stir them in moving air until cool to the touch. Let them rest a day before brewing.',
  });
  return phases;
}

export interface RoastGuideRequest {
  device: HomeRoastDevice;
  level: RoastLevel;
  greenGrams: number;
  suggestedLevel?: RoastLevel;
}

export interface HomeRoastGuide {
  device: HomeRoastDevice;
  deviceName: string;
  level: RoastLevel;
  greenGrams: number;
  batchGrams: { min: number; max: number };
  batches: number;
  /** Green grams per batch, as even as whole grams allow. */
  batchLoads: number[];
  expectedLossPct: { min: number; max: number; default: number };
  expectedRoastedGrams: { min: number; max: number; default: number };
  firstCrackSeconds: number;
  phases: RoastPhase[];
  afterFirstCrackSeconds: { min: number; max: number };
  levels: { level: RoastLevel; afterFirstCrackSeconds: { min: number; max: number }; suggested: boolean }[];
  notes: string[];
  cautions: readonly string[];
  source: string;
}

export function homeRoastGuide(request: RoastGuideRequest, lossModel: LossModel): HomeRoastGuide {
  const profile = homeRoastProfiles[request.device];
  if (!profile) throw new RangeError(`no roast guide for device ${request.device}`);
  const { greenGrams, level } = request;
  if (!Number.isSafeInteger(greenGrams) || greenGrams <= 0) throw new RangeError('greenGrams must be whole grams > 0');
  const batches = ceilDiv(greenGrams, profile.batchGrams.max);
  const smallLoad = Math.floor(greenGrams / batches);
  const largeCount = greenGrams - smallLoad * batches;
  const batchLoads = Array.from({ length: batches }, (_, index) => (index < largeCount ? smallLoad + 1 : smallLoad));
  const range = lossModel[level];
  const notes: string[] = [];
  if (smallLoad < profile.batchGrams.min) {
    notes.push(
      `Batches of ${smallLoad} g are under the usual ${profile.batchGrams.min}–${profile.batchGrams.max} g: ` +
        'they roast faster, so watch for first crack early.',
    );
  }
  notes.push('If the beans stop moving in the chamber, there are too many: take some out or they will scorch.');
  return {
    device: profile.device,
    deviceName: profile.name,
    level,
    greenGrams,
    batchGrams: profile.batchGrams,
    batches,
    batchLoads,
    expectedLossPct: { min: range.minPct, max: range.maxPct, default: range.defaultPct },
    expectedRoastedGrams: roastedYieldRange(greenGrams, range),
    firstCrackSeconds: profile.firstCrackSeconds,
    phases: phasesFor(profile, level),
    afterFirstCrackSeconds: profile.afterFirstCrackSeconds[level],
    levels: roastLevels.map((each) => ({
      level: each,
      afterFirstCrackSeconds: profile.afterFirstCrackSeconds[each],
      suggested: each === request.suggestedLevel,
    })),
    notes,
    cautions: homeRoastCautions,
    source: profile.source,
  };
}
