import { describe, expect, it } from 'vitest';
import { addressLines } from './address';

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
