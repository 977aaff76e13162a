import { ArrowLeft } from 'lucide-react';
import { Link, useNavigate } from 'react-router-dom';
import { PageTitle } from '@/components/seo/page-title';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { signedInLoader } from '@/features/auth/utils/require-user';
import { NewLotForm } from '@/features/green-stock/components/lot-forms';
import type { LotEditorState } from './lot-editor';

export const clientLoader = signedInLoader;

export default function NewLotRoute() {
  const navigate = useNavigate();
  return (
    <>
      <PageTitle title="New lot · Green Stock · Roastery" />
      <p className="mb-4">
        <Link to={paths.roastery.greenStock.getHref()} className="inline-flex min-h-11 items-center gap-1.5 font-semibold text-leaf underline">
          <ArrowLeft aria-hidden="true" className="size-4" />
          All of Green Stock
        </Link>
      </p>
      <PageHeader
        eyebrow="Green Stock"
        title="New lot"
        lead="Describe the lot as home roasters will read it. It starts with no stock: record its arrival on the next page."
      />
      <div className="max-w-4xl">
        <NewLotForm onCreated={(lot) => void navigate(paths.roastery.lot.getHref(lot.code), { state: { created: true } satisfies LotEditorState })} />
      </div>
    </>
  );
}
