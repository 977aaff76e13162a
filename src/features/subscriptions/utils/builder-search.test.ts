import { describe, expect, it } from 'vitest';
import { builderDefaults, builderFromSearch, completeBuildFromSearch, searchFromBuilder } from './builder-search';

describe('Roasted to Order choices in the URL', () => {
  it('round-trip through the search without losing anything', () => {
    const build = {
      lotCode: 'RD-T01',
      roastLevel: 'dark',
      bagSize: '2lb',
      bagsPerDelivery: 3,
      grind: 'french-press',
      brewMethod: 'filter',
      cadenceWeeks: 4,
    } as const;
    const search = searchFromBuilder(build);

    expect(search.toString()).toBe('lot=RD-T01&level=dark&size=2lb&bags=3&grind=french-press&brew=filter&every=4');
    expect(builderFromSearch(search)).toEqual(build);
    expect(completeBuildFromSearch(search)).toEqual(build);
  });

  it('write the Roaster’s Rotation as lot=rotation and read it back as no lot', () => {
    const search = searchFromBuilder({ ...builderDefaults, lotCode: null });

    expect(search.get('lot')).toBe('rotation');
    expect(builderFromSearch(search).lotCode).toBeNull();
    expect(completeBuildFromSearch(search)?.lotCode).toBeNull();
  });

  it('fall back to the defaults for values the rules refuse, so a hand-edited link still opens', () => {
    const read = builderFromSearch(new URLSearchParams('lot=RD-T01&level=burnt&size=5lb&bags=99&every=6&brew=espresso'));

    expect(read).toEqual({ ...builderDefaults, lotCode: 'RD-T01', brewMethod: 'espresso' });
  });

  it('count a set of choices as complete only when every one is present and allowed', () => {
    expect(completeBuildFromSearch(new URLSearchParams('lot=RD-T01&level=medium'))).toBeNull();
    expect(completeBuildFromSearch(new URLSearchParams('level=medium&size=1lb&bags=1&grind=whole-bean&brew=filter&every=2'))).toBeNull();
    expect(completeBuildFromSearch(new URLSearchParams('lot=rotation&level=medium&size=1lb&bags=11&grind=whole-bean&brew=filter&every=2'))).toBeNull();
  });

  it('leave a half-typed bag count out of the search rather than writing NaN', () => {
    expect(searchFromBuilder({ ...builderDefaults, bagsPerDelivery: Number.NaN }).has('bags')).toBe(false);
  });
});
