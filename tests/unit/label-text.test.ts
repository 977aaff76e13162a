import { describe, expect, it } from 'vitest';
import { printable } from '../../server/modules/packing/labels-pdf';

describe('printable (label text for the PDF standard fonts, Windows-1252)', () => {
  it('keeps ASCII, Latin-1 and the typographic marks Windows-1252 has', () => {
    expect(printable('Café Ünïcode — “Ridge” · 12 oz')).toBe('Café Ünïcode — “Ridge” · 12 oz');
  });

  it('drops accents the fonts lack and replaces what has no Latin letter with "?"', () => {
    expect(printable('Nguyễn Thị Đà Lạt')).toBe('Nguyen Thi Dà Lat');
    expect(printable('Łódź 王')).toBe('Lódz ?');
  });
});
