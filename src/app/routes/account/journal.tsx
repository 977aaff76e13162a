import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { homeRoastDeviceLabels, homeRoastDevices, type HomeRoastDevice } from '@shared/domain/vocabulary';
import type { JournalEntry, JournalListQuery } from '@shared/schemas/journal';
import { PageTitle } from '@/components/seo/page-title';
import { HomeRoastingCautions } from '@/components/safety/home-roasting-cautions';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { DownloadLink } from '@/components/ui/download-link';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { PageLoading } from '@/components/ui/page-loading';
import { SelectField } from '@/components/ui/select-field';
import { requireUser } from '@/features/auth/utils/require-user';
import { useDeleteJournalEntry } from '@/features/journal/api/delete-journal-entry';
import { getJournalQueryOptions, useJournal } from '@/features/journal/api/get-journal';
import { useSaveJournalEntry } from '@/features/journal/api/save-journal-entry';
import { JournalEntryForm } from '@/features/journal/components/journal-entry-form';
import { JournalList } from '@/features/journal/components/journal-list';
import { LotRoastsChart, RoastPhaseChart } from '@/features/journal/components/roast-chart';
import { RoastFigures } from '@/features/journal/components/roast-figures';

function filterOf(search: URLSearchParams): JournalListQuery {
  const device = search.get('device');
  return {
    ...(search.get('lot') ? { lotCode: search.get('lot')! } : {}),
    ...(device && (homeRoastDevices as readonly string[]).includes(device) ? { device: device as HomeRoastDevice } : {}),
  };
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const search = new URL(request.url).searchParams;
    // A roast being logged from an order lists every lot; the filter waits until it is saved.
    void queryClient.prefetchQuery(getJournalQueryOptions(search.get('log') ? {} : filterOf(search)));
    return null;
  };

/** Today in the customer's own calendar (the browser's), as the form's starting roast date. */
const localToday = () => new Date().toLocaleDateString('en-CA');

type Editing = { mode: 'new'; lotCode?: string | undefined } | { mode: 'change'; entry: JournalEntry } | null;

export default function JournalRoute() {
  const [search, setSearch] = useSearchParams();
  const logging = search.get('log') !== null;
  const filter = logging ? {} : filterOf(search);
  const journal = useJournal(filter);
  const save = useSaveJournalEntry();
  const remove = useDeleteJournalEntry();
  const [editing, setEditing] = useState<Editing>(null);
  const [selectedId, setSelectedId] = useState<string>();
  const [deleting, setDeleting] = useState<JournalEntry>();

  const form: Editing = editing ?? (logging ? { mode: 'new', lotCode: search.get('lot') ?? undefined } : null);

  const setFilter = (name: 'lot' | 'device', value: string) => {
    const next = new URLSearchParams(search);
    next.delete('log');
    if (value) next.set(name, value);
    else next.delete(name);
    setSearch(next, { replace: true });
  };
  const closeForm = () => {
    setEditing(null);
    if (logging) {
      const next = new URLSearchParams(search);
      next.delete('log');
      setSearch(next, { replace: true });
    }
  };

  if (journal.isPending) return <PageLoading />;
  if (journal.isError) return <ErrorState title="Your Roast Journal could not be loaded" error={journal.error} onRetry={() => void journal.refetch()} />;

  const { items, lots } = journal.data;
  const selected = items.find((entry) => entry.id === selectedId) ?? (form ? undefined : items[0]);
  const sameLot = selected ? items.filter((entry) => entry.lotCode === selected.lotCode) : [];

  return (
    <>
      <PageTitle title="Roast Journal" />
      <PageHeader
        title="Roast Journal"
        lead="Log each home roast: Restday works out the weight loss, development time and the level it points to, and compares it with the lot's Home Roast Guide."
      />
      <div className="mb-6 flex flex-wrap gap-3">
        {form ? null : <Button onClick={() => setEditing({ mode: 'new', lotCode: filter.lotCode })}>Log a roast</Button>}
        {items.length > 0 ? <DownloadLink href="/api/journal.csv">Download CSV</DownloadLink> : null}
      </div>

      {form ? (
        <section aria-labelledby="journal-form-title" className="mb-8 grid gap-6 rounded-card border border-rule bg-sheet p-5 lg:grid-cols-[3fr_2fr]">
          <div>
            <h2 id="journal-form-title" className="mb-4 text-h2">
              {form.mode === 'change' ? 'Change this roast' : 'Log a roast'}
            </h2>
            <JournalEntryForm
              key={form.mode === 'change' ? form.entry.id : `new-${form.lotCode ?? ''}`}
              lots={lots}
              today={localToday()}
              {...(form.mode === 'change' ? { entry: form.entry } : form.lotCode ? { lotCode: form.lotCode } : {})}
              onCancel={closeForm}
              onSubmit={async (input) => {
                const saved = await save.mutateAsync(form.mode === 'change' ? { id: form.entry.id, input } : { input });
                setSelectedId(saved.id);
                closeForm();
              }}
            />
          </div>
          <HomeRoastingCautions />
        </section>
      ) : null}

      {selected ? (
        <section aria-labelledby="journal-selected-title" className="mb-8 grid gap-6 rounded-card border border-rule bg-sheet p-5 lg:grid-cols-2">
          <div className="grid content-start gap-6">
            <h2 id="journal-selected-title" className="text-h2">
              {selected.lotName}, {selected.roastedOn}
            </h2>
            <RoastFigures entry={selected} />
            <RoastPhaseChart entry={selected} />
          </div>
          <LotRoastsChart entries={sameLot} selectedId={selected.id} />
        </section>
      ) : null}

      <section aria-labelledby="journal-list-title">
        <h2 id="journal-list-title" className="mb-3 text-h2">
          Your roasts
        </h2>
        <div className="mb-4 flex flex-wrap gap-4">
          <SelectField label="Lot" value={filter.lotCode ?? ''} onChange={(event) => setFilter('lot', event.target.value)}>
            <option value="">Every lot</option>
            {lots.map((lot) => (
              <option key={lot.code} value={lot.code}>
                {lot.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Device" value={filter.device ?? ''} onChange={(event) => setFilter('device', event.target.value)}>
            <option value="">Every device</option>
            {homeRoastDevices.map((device) => (
              <option key={device} value={device}>
                {homeRoastDeviceLabels[device]}
              </option>
            ))}
          </SelectField>
        </div>
        {items.length === 0 ? (
          <EmptyState title="No roasts here yet">Log your first roast of a lot and Restday will work out what happened.</EmptyState>
        ) : (
          <JournalList
            entries={items}
            selectedId={selected?.id}
            onShow={(entry) => setSelectedId(entry.id)}
            onEdit={(entry) => setEditing({ mode: 'change', entry })}
            onDelete={setDeleting}
          />
        )}
      </section>

      <ConfirmDialog
        open={deleting !== undefined}
        title="Delete this roast?"
        confirmLabel="Delete roast"
        cancelLabel="Keep it"
        busy={remove.isPending}
        onCancel={() => setDeleting(undefined)}
        onConfirm={() => {
          if (!deleting) return;
          void remove.mutateAsync(deleting.id).then(() => setDeleting(undefined));
        }}
      >
        {deleting ? `${deleting.lotName}, roasted ${deleting.roastedOn}, leaves your journal for good.` : ''}
      </ConfirmDialog>
    </>
  );
}
