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

  it('names the source beside every figure, marking common practice and figures from memory', async () => {
    renderApp('/roasting-basics');

    const cracks = await screen.findByRole('region', { name: 'First and second crack' });
    expect(within(cracks).getByText(/196–205 °C/)).toBeTruthy();
    expect(within(cracks).getByText(/224–230 °C/)).toBeTruthy();
    expect(within(cracks).getByText(/ChartsBin, Degree of Coffee Roasting; the 196 °C and 224 °C figures from memory/)).toBeTruthy();
    expect(within(cracks).getByText(/14–20% in all/)).toBeTruthy();
    expect(within(cracks).getByText(/Barista Hustle, RS 3.05 Mass Loss/)).toBeTruthy();
    expect(within(cracks).getByText(/S. Rao, Development Time Ratio, 2016/)).toBeTruthy();

    const rest = screen.getByRole('region', { name: 'Rest and storage' });
    expect(within(rest).getByText(/Smrke et al., J. Agric. Food Chem. 2017/)).toBeTruthy();
    const restDays = within(rest).getByText(/filter coffee is usually rested 2–7 days and espresso 7–14 days/);
    expect(within(restDays).getByText('(from memory)').tagName).toBe('CITE');
    expect(within(rest).getByText(/ICO, Good Hygiene Practices/)).toBeTruthy();

    const cooling = screen.getByRole('region', { name: 'Cooling and chaff' });
    expect(within(cooling).getAllByText('(common practice)')).toHaveLength(2);

    const larger = screen.getByRole('region', { name: 'Roasting beyond the kitchen' });
    expect(within(larger).getByText(/NIOSH, flavorings-related lung disease exposure limits/)).toBeTruthy();
    expect(within(larger).getByText(/licensed installers/)).toBeTruthy();

    // Every <cite> on the page names a source or says which kind of figure it is.
    const citations = [...document.querySelectorAll('main cite')].map((cite) => cite.textContent ?? '');
    expect(citations.length).toBeGreaterThan(10);
    for (const citation of citations) expect(citation).toMatch(/^\(.+\)$/);

    const sources = screen.getByRole('region', { name: 'Sources' });
    for (const name of ['NFPA', 'ChartsBin', 'Barista Hustle', 'Everything2', 'Smrke', 'ISO 8455', 'NIOSH', 'Fire Engineering']) {
      expect(within(sources).getByText(new RegExp(name))).toBeTruthy();
    }
  });
});
