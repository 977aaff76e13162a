import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { carrierNamesAreUnique, findCarrier, isTrackingUrlTemplate, trackingUrl } from './carriers';

const carriers = [
  { name: 'Kestrel Post', trackingUrlTemplate: 'https://track.example.com/parcel/{tracking}' },
  { name: 'Larkspur Freight', trackingUrlTemplate: 'https://larkspur.example.net/find?number={tracking}&lang=en' },
];

describe('isTrackingUrlTemplate', () => {
  it('accepts an https address that holds the {tracking} placeholder, in the path or the query', () => {
    expect(isTrackingUrlTemplate(carriers[0]!.trackingUrlTemplate)).toBe(true);
    expect(isTrackingUrlTemplate(carriers[1]!.trackingUrlTemplate)).toBe(true);
  });

  it('refuses an address without the placeholder, a plain-http one, and text that is no address', () => {
    expect(isTrackingUrlTemplate('https://track.example.com/parcel/')).toBe(false);
    expect(isTrackingUrlTemplate('http://track.example.com/{tracking}')).toBe(false);
    expect(isTrackingUrlTemplate('javascript:alert({tracking})')).toBe(false);
    expect(isTrackingUrlTemplate('track {tracking}')).toBe(false);
  });
});

describe('trackingUrl', () => {
  it('puts the tracking number in place of the placeholder', () => {
    expect(trackingUrl(carriers[1]!.trackingUrlTemplate, 'KP123')).toBe('https://larkspur.example.net/find?number=KP123&lang=en');
  });

  it('encodes spaces, ampersands and slashes in the number so it cannot change the address', () => {
    expect(trackingUrl(carriers[0]!.trackingUrlTemplate, ' 9400 11/2&x=1 ')).toBe('https://track.example.com/parcel/9400%2011%2F2%26x%3D1');
  });

  it('gives back the number when the page reads the parameter (property)', () => {
    fc.assert(
      fc.property(
        fc.string({ minLength: 1, maxLength: 40 }).filter((s) => s.trim() === s && s.length > 0),
        (number) => {
          const url = new URL(trackingUrl('https://track.example.com/find?number={tracking}', number));
          expect(url.searchParams.get('number')).toBe(number);
        },
      ),
    );
  });
});

describe('findCarrier', () => {
  it('finds the shop carrier by name whatever the case and surrounding spaces', () => {
    expect(findCarrier(carriers, '  kestrel POST ')).toBe(carriers[0]);
  });

  it('finds nothing for a carrier the shop has not listed', () => {
    expect(findCarrier(carriers, 'Heron Parcel')).toBeUndefined();
  });
});

describe('carrierNamesAreUnique', () => {
  it('refuses two carriers whose names differ only in case', () => {
    expect(carrierNamesAreUnique(carriers)).toBe(true);
    expect(carrierNamesAreUnique([...carriers, { name: 'KESTREL post', trackingUrlTemplate: carriers[0]!.trackingUrlTemplate }])).toBe(false);
  });
});
