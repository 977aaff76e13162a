import { describe, expect, it } from 'vitest';
import { fileProblem, formatFileSize } from './file-checks';

const MB = 1024 * 1024;
const fileOf = (name: string, type: string, bytes: number) => new File([new Uint8Array(bytes)], name, { type });

describe('lot files checked before upload', () => {
  it('lets through photos up to 5 MB and spec sheets up to 10 MB', () => {
    expect(fileProblem(fileOf('sacks.jpg', 'image/jpeg', 5 * MB), 'photo')).toBeUndefined();
    expect(fileProblem(fileOf('sacks.webp', 'image/webp', 1000), 'photo')).toBeUndefined();
    expect(fileProblem(fileOf('sheet.pdf', 'application/pdf', 10 * MB), 'specSheet')).toBeUndefined();
  });

  it('refuses the wrong type, one byte over the limit, and an empty file', () => {
    expect(fileProblem(fileOf('mark.svg', 'image/svg+xml', 100), 'photo')).toBe('mark.svg is not a JPEG, PNG or WebP image.');
    expect(fileProblem(fileOf('sacks.png', 'image/png', 5 * MB + 1), 'photo')).toBe('sacks.png is 5 MB; the limit is 5 MB.');
    expect(fileProblem(fileOf('sheet.pdf', 'application/pdf', 10 * MB + 1), 'specSheet')).toBe('sheet.pdf is 10 MB; the limit is 10 MB.');
    expect(fileProblem(fileOf('sheet.pdf', 'application/pdf', 0), 'specSheet')).toBe('sheet.pdf is empty.');
  });

  it('goes by the name when the browser gives no type', () => {
    expect(fileProblem(fileOf('SHEET.PDF', '', 100), 'specSheet')).toBeUndefined();
    expect(fileProblem(fileOf('sheet.docx', '', 100), 'specSheet')).toBe('sheet.docx is not a PDF.');
  });

  it('writes sizes in KB and MB', () => {
    expect(formatFileSize(2048)).toBe('2 KB');
    expect(formatFileSize(2.5 * MB)).toBe('2.5 MB');
  });
});
