import { describe, expect, it } from 'vitest';
import { parseSubscriberFilters, subscriberFiltersToSearch } from './subscriber-filters';

describe('Subscribers filters in the URL', () => {
  it('read every filter the API accepts and write them back in a stable order', () => {
    const filters = parseSubscriberFilters(new URLSearchParams('page=3&lot=rotation&cadence=2&level=light&status=paused&q=marlow&sort=name'));

    expect(filters).toEqual({ status: 'paused', level: 'light', cadence: 2, lot: 'rotation', q: 'marlow', sort: 'name', page: 3 });
    expect(subscriberFiltersToSearch(filters).toString()).toBe('status=paused&level=light&cadence=2&lot=rotation&q=marlow&sort=name&page=3');
    expect(subscriberFiltersToSearch(filters, { withPage: false }).toString()).toBe('status=paused&level=light&cadence=2&lot=rotation&q=marlow&sort=name');
  });

  it('drop values the API would refuse, and keep the first page and newest-first out of the URL', () => {
    const filters = parseSubscriberFilters(new URLSearchParams('status=lost&cadence=9&level=&page=0&sort=newest'));

    expect(filters).toEqual({ page: 1 });
    expect(subscriberFiltersToSearch(filters).toString()).toBe('');
  });
});
