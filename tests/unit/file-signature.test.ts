import { describe, expect, it } from 'vitest';
import { detectFileType } from '../../server/modules/uploads/file-signature';

const bytes = (...values: number[]) => Uint8Array.from(values);
const text = (value: string) => new TextEncoder().encode(value);

describe('detectFileType', () => {
  it('recognises JPEG by FF D8 FF', () => {
    expect(detectFileType(bytes(0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10))).toBe('jpeg');
  });

  it('recognises PNG by its eight-byte signature', () => {
    expect(detectFileType(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0x00))).toBe('png');
  });

  it('recognises WebP by RIFF, any four size bytes, then WEBP', () => {
    expect(detectFileType(text('RIFF\u0024\u0000\u0000\u0000WEBPVP8 '))).toBe('webp');
  });

  it('recognises PDF by %PDF-', () => {
    expect(detectFileType(text('%PDF-1.7\n'))).toBe('pdf');
  });

  it('refuses other RIFF files, near misses, short input and text', () => {
    expect(detectFileType(text('RIFF\u0024\u0000\u0000\u0000WAVEfmt '))).toBeUndefined();
    expect(detectFileType(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a))).toBeUndefined();
    expect(detectFileType(bytes(0xff, 0xd8))).toBeUndefined();
    expect(detectFileType(text('%PDF'))).toBeUndefined();
    expect(detectFileType(text('<svg xmlns="http://www.w3.org/2000/svg"/>'))).toBeUndefined();
    expect(detectFileType(new Uint8Array())).toBeUndefined();
  });

  it('reads the content, not a name: a PDF body is a PDF whatever it is called', () => {
    expect(detectFileType(text('%PDF-1.4 pretending to be photo.jpg'))).toBe('pdf');
  });
});
