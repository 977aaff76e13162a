import { LogIn } from 'lucide-react';
import { Link } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { paths } from '@/config/paths';

export default function AccountOverviewRoute() {
  return (
    <>
      <PageTitle title="Your account" />
      <section className="mx-auto max-w-prose rounded-card border border-rule bg-sheet p-6 text-center shadow-card sm:p-10">
        <LogIn aria-hidden="true" className="mx-auto size-8 text-leaf" />
        <h1 className="mt-3 text-h1">Sign in to see your orders</h1>
        <p className="mt-3 text-ink-muted">
          Your orders, your upcoming Deliveries and your Roast Journal will live here once you are signed in. Signing in is not open
          yet; it is coming soon.
        </p>
        <p className="mt-6">
          <Link to={paths.lots.getHref()} className="font-semibold text-leaf underline">
            Browse Green Lots meanwhile
          </Link>
        </p>
      </section>
    </>
  );
}
