import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { HomeRoastingCautions } from '@/components/safety/home-roasting-cautions';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TableBody, TableCell, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { paths } from '@/config/paths';

function Source({ children }: { children: ReactNode }) {
  return <cite className="text-small not-italic text-ink-muted">({children})</cite>;
}

const phases = [
  { name: 'Drying', cue: 'The beans turn from green to pale yellow and smell of cut grass or hay.' },
  { name: 'Browning', cue: 'Yellow gives way to light brown and the smell turns bread-like as the Maillard reactions run.' },
  { name: 'First crack', cue: 'The beans pop audibly as steam and gas escape. From here on the roast is developing.' },
  { name: 'Development', cue: 'Light brown deepens to dark brown. Stop when the beans reach the level you are after.' },
];

const afterFirstCrack = [
  { level: 'Light', time: 'about 10 s (5–10 s of cracking)' },
  { level: 'Medium', time: '20–30 s' },
  { level: 'Medium-dark', time: '30–40 s' },
  { level: 'Dark', time: 'about 60 s' },
  { level: 'French', time: 'about 90 s' },
];

export default function RoastingBasicsRoute() {
  return (
    <div className="max-w-prose">
      <PageTitle title="Roasting basics" />
      <PageHeader
        eyebrow="For home roasters"
        title="Roasting basics"
        lead="What happens to green coffee in a roast, how long to go on after first crack, and how to do it safely. Every figure here names where it comes from."
      />

      <HomeRoastingCautions />

      <section aria-labelledby="phases" className="mt-10">
        <h2 id="phases" className="text-h2">
          What happens in a roast
        </h2>
        <ol className="mt-4 space-y-3">
          {phases.map((phase, index) => (
            <li key={phase.name} className="flex gap-3">
              <span aria-hidden="true" className="flex size-8 shrink-0 items-center justify-center rounded-pill bg-leaf text-small font-semibold text-sheet">
                {index + 1}
              </span>
              <p>
                <strong>{phase.name}.</strong> {phase.cue}
              </p>
            </li>
          ))}
        </ol>
        <p className="mt-3">
          <Source>common practice</Source>
        </p>
      </section>

      <section aria-labelledby="cracks" className="mt-10">
        <h2 id="cracks" className="text-h2">
          First and second crack
        </h2>
        <p className="mt-4">
          First crack is the popping, like quiet popcorn, as steam and gas burst out of the beans; it comes at a bean temperature of roughly 196–205 °C. Second
          crack is faster and sharper, like crackling twigs, at roughly 224–230 °C; oil starts to show on the beans and the smoke thickens, so a dark roast
          stops soon after it begins. What a probe reads varies from machine to machine.{' '}
          <Source>ChartsBin, Degree of Coffee Roasting; the 196 °C and 224 °C figures from memory</Source>
        </p>
        <p className="mt-3">
          Development time is the time from first crack to the end of the roast, and the development time ratio is that time divided by the whole roast; drum
          roasters often aim for 20–25%. <Source>S. Rao, Development Time Ratio, 2016</Source>
        </p>
        <p className="mt-3">
          Beans lose weight as they roast, mostly water: typically 14–20% in all, more the darker the roast.{' '}
          <Source>Barista Hustle, RS 3.05 Mass Loss, citing Schenker 2000 and Clarke 1987</Source> So 80 g of green beans come out at roughly 64–69 g roasted.
        </p>
      </section>

      <section aria-labelledby="popper" className="mt-10">
        <h2 id="popper" className="text-h2">
          In a hot-air popper
        </h2>
        <ul className="mt-4 list-disc space-y-2 pl-5">
          <li>
            Load about 75–80 g of green beans, roughly half a kitchen cup. The beans must keep moving; if they sit still, there are too many and they will
            scorch. <Source>common practice</Source>
          </li>
          <li>
            First crack tends to arrive around three minutes in, but every popper and every mains supply is different. <Source>common practice</Source> One
            1,000 W popper has been reported to roast 80 g in 7.5–8 minutes. <Source>Everything2 write-up on popper roasting</Source>
          </li>
        </ul>

        <h3 className="mt-6 text-h3">Time after first crack, by roast level</h3>
        <p className="mt-1 text-small text-ink-muted">A ballpark only: judge by colour and sound as well. (common practice)</p>
        <Table variant="prose" className="mt-3">
          <TableHead>
            <tr>
              <TableHeader>Roast level</TableHeader>
              <TableHeader>Keep going after first crack for</TableHeader>
            </tr>
          </TableHead>
          <TableBody>
            {afterFirstCrack.map((row) => (
              <tr key={row.level}>
                <TableRowHeader>{row.level}</TableRowHeader>
                <TableCell>{row.time}</TableCell>
              </tr>
            ))}
          </TableBody>
        </Table>
      </section>

      <section aria-labelledby="after" className="mt-10">
        <h2 id="after" className="text-h2">
          Cooling and chaff
        </h2>
        <ul className="mt-4 list-disc space-y-2 pl-5">
          <li>
            Cool the beans the moment you stop: tip them into a colander and keep air moving through them, or they go on roasting.{' '}
            <Source>common practice</Source>
          </li>
          <li>
            Chaff, the papery skin, flies off during the roast. Catch it and clear it away. <Source>common practice</Source>
          </li>
        </ul>
      </section>

      <section aria-labelledby="rest" className="mt-10">
        <h2 id="rest" className="text-h2">
          Rest and storage
        </h2>
        <ul className="mt-4 list-disc space-y-2 pl-5">
          <li>
            Fresh beans give off CO₂ for about the first 24–48 hours; taste them from about a day after roasting, and keep them in a bag with a one-way valve or
            one that is loosely closed. <Source>common practice</Source>
          </li>
          <li>
            Degassing goes on for days to weeks, faster for darker roasts and for ground coffee.{' '}
            <Source>Smrke et al., J. Agric. Food Chem. 2017; X. Wang, PhD thesis, University of Guelph, 2014</Source>
          </li>
          <li>
            For brewing, filter coffee is usually rested 2–7 days and espresso 7–14 days, and is at its best roughly from day 4 to day 21, within about four
            weeks in a valve bag. <Source>from memory</Source>
          </li>
          <li>
            Keep green beans cool and dry, at about 20 °C and 60–65% relative humidity, where they keep well for up to about a year.{' '}
            <Source>general food press; guidelines in ISO 8455</Source> Mould cannot grow below a water activity of about 0.68.{' '}
            <Source>ICO, Good Hygiene Practices</Source>
          </li>
        </ul>
      </section>

      <section aria-labelledby="larger" className="mt-10">
        <h2 id="larger" className="text-h2">
          Roasting beyond the kitchen
        </h2>
        <p className="mt-4">
          Bigger roasters bring bigger hazards: chaff fires in the roaster and its ducts, smoke, and carbon monoxide, which roasted coffee keeps giving off in
          storage (35–150+ ppm has been measured near large totes). <Source>Fire Engineering, carbon monoxide at a roasted coffee facility</Source> Grinding and
          packing raise exposure to diacetyl and 2,3-pentanedione, which have recommended limits of 5 ppb and 9.3 ppb over an 8-hour day.{' '}
          <Source>NIOSH, flavorings-related lung disease exposure limits</Source> Air permits depend on the local air-quality district, and gas appliances on
          local codes: these are matters for local rules and licensed installers, not for this page.{' '}
          <Source>Sacramento Metropolitan AQMD, Coffee Bean Roasting Operations, as one district&rsquo;s example</Source>
        </p>
      </section>

      <section aria-labelledby="sources" className="mt-10 border-t border-rule pt-6">
        <h2 id="sources" className="text-h3">
          Sources
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-small text-ink-muted">
          <li>NFPA, Home Fires Involving Cooking Equipment (2017).</li>
          <li>ChartsBin, Degree of Coffee Roasting.</li>
          <li>S. Rao, Development Time Ratio (2016).</li>
          <li>Barista Hustle, RS 3.05 Mass Loss.</li>
          <li>Everything2, write-up on popper roasting.</li>
          <li>Smrke, Wellinger, Suzuki, Balsiger, Opitz, Yeretzian, J. Agric. Food Chem. 2017, doi 10.1021/acs.jafc.7b03310.</li>
          <li>X. Wang, PhD thesis, University of Guelph (2014).</li>
          <li>ICO, Good Hygiene Practices; ISO 8455, green coffee storage and transport.</li>
          <li>Fire Engineering, Determining the Source of Carbon Monoxide Levels at a Roasted Coffee Facility.</li>
          <li>NIOSH, Flavorings-related lung disease, exposure limits.</li>
          <li>Sacramento Metropolitan AQMD, Coffee Bean Roasting Operations.</li>
          <li>&ldquo;Common practice&rdquo; marks what home roasters widely do and agree on, with no single published source.</li>
          <li>&ldquo;From memory&rdquo; marks a figure recalled from the trade and not yet checked against a published source.</li>
        </ul>
      </section>

      <p className="mt-8">
        <Link to={paths.lots.getHref()} className="font-semibold text-leaf underline">
          Find a lot to roast
        </Link>
      </p>
    </div>
  );
}
