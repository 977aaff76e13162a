import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { HomeRoastingCautions } from '@/components/safety/home-roasting-cautions';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
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
        <p className="mt-4">
          First crack comes at a bean temperature of roughly 196–205 °C and second crack at roughly 224–230 °C; what a probe reads
          varies from machine to machine. <Source>ChartsBin, Degree of Coffee Roasting; the lower figures from memory</Source>
        </p>
      </section>

      <section aria-labelledby="popper" className="mt-10">
        <h2 id="popper" className="text-h2">
          In a hot-air popper
        </h2>
        <ul className="mt-4 list-disc space-y-2 pl-5">
          <li>
            Load about 75–80 g of green beans, roughly half a kitchen cup. The beans must keep moving; if they sit still, there are too
            many and they will scorch. <Source>common practice</Source>
          </li>
          <li>
            First crack tends to arrive around three minutes in, but every popper and every mains supply is different.{' '}
            <Source>common practice</Source> One 1,000 W popper has been reported to roast 80 g in 7.5–8 minutes.{' '}
            <Source>Everything2 write-up on popper roasting</Source>
          </li>
        </ul>

        <h3 className="mt-6 text-h3">Time after first crack, by roast level</h3>
        <p className="mt-1 text-small text-ink-muted">A ballpark only: judge by colour and sound as well. (common practice)</p>
        <table className="mt-3 w-full border-collapse text-left">
          <thead>
            <tr className="border-b border-rule-strong">
              <th scope="col" className="py-2 pr-4 font-semibold">
                Roast level
              </th>
              <th scope="col" className="py-2 font-semibold">
                Keep going after first crack for
              </th>
            </tr>
          </thead>
          <tbody>
            {afterFirstCrack.map((row) => (
              <tr key={row.level} className="border-b border-rule">
                <th scope="row" className="py-2 pr-4 font-normal">
                  {row.level}
                </th>
                <td className="py-2">{row.time}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section aria-labelledby="after" className="mt-10">
        <h2 id="after" className="text-h2">
          Cooling, chaff and rest
        </h2>
        <ul className="mt-4 list-disc space-y-2 pl-5">
          <li>
            Cool the beans the moment you stop: tip them into a colander and keep air moving through them, or they go on roasting.{' '}
            <Source>common practice</Source>
          </li>
          <li>
            Chaff, the papery skin, flies off during the roast. Catch it and clear it away. <Source>common practice</Source>
          </li>
          <li>
            Fresh beans give off CO₂ for about the first 24–48 hours; taste them from about a day after roasting, and keep them in a
            bag with a one-way valve or one that is loosely closed. <Source>common practice</Source> Degassing goes on for days to weeks,
            faster for darker roasts and for ground coffee. <Source>Smrke et al., J. Agric. Food Chem. 2017</Source>
          </li>
        </ul>
      </section>

      <section aria-labelledby="sources" className="mt-10 border-t border-rule pt-6">
        <h2 id="sources" className="text-h3">
          Sources
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-small text-ink-muted">
          <li>NFPA, Home Fires Involving Cooking Equipment (2017).</li>
          <li>ChartsBin, Degree of Coffee Roasting.</li>
          <li>Everything2, write-up on popper roasting.</li>
          <li>Smrke, Wellinger, Suzuki, Balsiger, Opitz, Yeretzian, J. Agric. Food Chem. 2017, doi 10.1021/acs.jafc.7b03310.</li>
          <li>&ldquo;Common practice&rdquo; marks what home roasters widely do and agree on, with no single published source.</li>
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
