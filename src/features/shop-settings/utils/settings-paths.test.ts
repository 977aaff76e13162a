import { describe, expect, it } from 'vitest';
import { fieldPaths } from './settings-paths';

describe('settings field paths', () => {
  it('names every leaf and every parent, array items by index', () => {
    expect(fieldPaths({ timeZone: 'America/Denver', roaster: { minLoadPct: 50 }, roastWeekdays: ['tue'], shipping: { bands: [{ cents: 695 }] } })).toEqual([
      'timeZone',
      'roaster',
      'roaster.minLoadPct',
      'roastWeekdays',
      'roastWeekdays.0',
      'shipping',
      'shipping.bands',
      'shipping.bands.0',
      'shipping.bands.0.cents',
    ]);
  });
});
