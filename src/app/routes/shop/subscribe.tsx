import { Link } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { buttonStyles } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';

const steps = [
  {
    title: 'Choose your coffee',
    text: 'Pick a lot from the green shelf, or take the Roaster’s Rotation: a different lot chosen by the roaster each time.',
  },
  {
    title: 'Make it yours',
    text: 'Roast level (among those that suit the lot), bag size of 12 oz, 1 lb or 2 lb, how many bags, and whole bean or a grind for your brew method.',
  },
  {
    title: 'Set the rhythm',
    text: 'A delivery every 1, 2, 3 or 4 weeks. Skip one, pause until a date, change anything or cancel, whenever you like.',
  },
  {
    title: 'Roasted, rested, ready',
    text: 'Your order is roasted on the next roast day after the order cutoff, rests while it gives off CO₂, and ships so it is ready to brew when it lands. You get an e-mail when it ships, and another on its rest day, the day it is ready.',
  },
];

export default function SubscribeRoute() {
  return (
    <>
      <PageTitle title="Roasted to Order" />
      <PageHeader
        eyebrow="Subscription"
        title="Roasted to Order"
        lead="Coffee roasted for you on a roast day, not pulled from a shelf, and timed so it reaches you ready to brew."
      />

      <ol className="grid gap-4 sm:grid-cols-2">
        {steps.map((step, index) => (
          <li key={step.title} className="rounded-card border border-rule bg-sheet p-5 shadow-card">
            <p className="font-heading text-h2 font-semibold text-ember" aria-hidden="true">
              {index + 1}
            </p>
            <h2 className="mt-1 text-h3">{step.title}</h2>
            <p className="mt-2 text-ink-muted">{step.text}</p>
          </li>
        ))}
      </ol>

      <section aria-labelledby="why-rest" className="mt-10 max-w-prose">
        <h2 id="why-rest" className="text-h2">
          Why the rest?
        </h2>
        <p className="mt-3">
          Freshly roasted coffee is still giving off carbon dioxide, and brewed too soon it tastes sharp and uneven. Each bag carries
          its roast date and a ready-from date; espresso needs a longer rest than filter, so your brew method sets the date. Each bag
          also shows a best-before date, the end of its best window.
        </p>
      </section>

      <section className="mt-10 rounded-card bg-leaf-wash p-6 sm:p-8">
        <h2 className="text-h3">Subscriptions are opening soon</h2>
        <p className="mt-2 max-w-prose">
          You cannot start a Roasted to Order subscription here just yet. In the meantime, the green shelf is open.
        </p>
        <Link to={paths.lots.getHref()} className={buttonStyles('primary', 'mt-5')}>
          Browse Green Lots
        </Link>
      </section>
    </>
  );
}
