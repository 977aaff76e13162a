// @vitest-environment happy-dom
import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { renderApp } from '@/testing/test-utils';

afterEach(cleanup);

describe('roasting basics page', () => {
  it('shows the home-roasting cautions with their sources', async () => {
    renderApp('/roasting-basics');

    const cautions = await screen.findByRole('region', { name: 'Roast safely' });
    expect(within(cautions).getByText('Never leave a roast unattended.')).toBeTruthy();
    expect(within(cautions).getByText(/NFPA, Home Fires Involving Cooking Equipment, 2017/)).toBeTruthy();
    expect(within(cautions).getByText(/outside its maker’s intended purpose/)).toBeTruthy();
    expect(within(cautions).getByText(/not legal advice/)).toBeTruthy();

    const popper = screen.getByRole('region', { name: 'In a hot-air popper' });
    expect(within(popper).getByText(/75–80 g of green beans/)).toBeTruthy();
    expect(within(popper).getByRole('rowheader', { name: 'French' }).nextElementSibling?.textContent).toBe('about 90 s');
  });
});
