import { describe, expect, it } from 'vitest';
import { addressLines, samePostalAddress } from './address';

const address = { name: 'Robin Alder', line1: '418 Larkspur Lane', line2: null, city: 'Cinder Hollow', region: 'CO', postalCode: '81522', country: 'US' };

describe('addressLines', () => {
  it('prints the name, street, town line and country', () => {
    expect(addressLines(address)).toEqual(['Robin Alder', '418 Larkspur Lane', 'Cinder Hollow, CO 81522', 'US']);
  });

  it('prints the second street line only when there is one', () => {
    expect(addressLines({ ...address, line2: 'Unit 4' })).toEqual(['Robin Alder', '418 Larkspur Lane', 'Unit 4', 'Cinder Hollow, CO 81522', 'US']);
    expect(addressLines({ ...address, line2: undefined })).toHaveLength(4);
  });
});

describe('samePostalAddress', () => {
  it('is true for the same fields, a missing second line reading as none', () => {
    expect(samePostalAddress(address, { ...address, line2: undefined })).toBe(true);
  });

  it('is false when any one field differs', () => {
    for (const field of ['name', 'line1', 'line2', 'city', 'region', 'postalCode', 'country'] as const) {
      expect(samePostalAddress(address, { ...address, [field]: 'Other' })).toBe(false);
    }
  });
});
