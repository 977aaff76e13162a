import { NotFoundMessage } from '@/components/errors/not-found-message';
import { PageTitle } from '@/components/seo/page-title';

export default function NotFoundRoute() {
  return (
    <>
      <PageTitle title="Page not found" />
      <NotFoundMessage />
    </>
  );
}
