import clsx from 'clsx';
import { useId } from 'react';
import { homeRoastProfiles, roastGuideDevices } from '@shared/domain/home-roast-guide';
import { bagFillGrams } from '@shared/domain/units';
import { roastLevelLabels, roastLevels, type GreenBagSize, type HomeRoastDevice, type RoastLevel } from '@shared/domain/vocabulary';
import { Badge } from '@/components/ui/badge';
import { ErrorState } from '@/components/ui/error-state';
import { SelectField } from '@/components/ui/select-field';
import { Skeleton } from '@/components/ui/skeleton';
import { Table, TableBody, TableCell, TableHead, TableHeader, TableRowHeader } from '@/components/ui/table';
import { formatPercent } from '@/lib/format';
import { useRoastGuide } from '../api/get-roast-guide';
import { bagSizeLabel, formatWeight, type WeightUnit } from '../utils/weight-unit';

function formatSeconds({ min, max }: { min: number; max: number }): string {
  return min === max ? `about ${min} s` : `${min}–${max} s`;
}

/** [76, 76, 75] → "75–76 g" */
function formatLoads(loads: number[], unit: WeightUnit): string {
  const least = Math.min(...loads);
  const most = Math.max(...loads);
  return least === most ? formatWeight(least, unit) : `${formatWeight(least, unit)}–${formatWeight(most, unit)}`;
}

type HomeRoastGuideProps = {
  lotCode: string;
  size: GreenBagSize;
  unit: WeightUnit;
  device: HomeRoastDevice;
  onDeviceChange: (device: HomeRoastDevice) => void;
  level: RoastLevel;
  onLevelChange: (level: RoastLevel) => void;
};

/** The Home Roast Guide for the chosen bag size, device and roast level, from the trade engine. */
export function HomeRoastGuide({ lotCode, size, unit, device, onDeviceChange, level, onLevelChange }: HomeRoastGuideProps) {
  const headingId = useId();
  const guideQuery = useRoastGuide({ code: lotCode, device, greenGrams: bagFillGrams(size), level });
  const guide = guideQuery.data;

  return (
    <section aria-labelledby={headingId} className="mt-10">
      <h2 id={headingId} className="text-h2">
        Home Roast Guide
      </h2>
      <div className="mt-3 grid max-w-xl gap-4 sm:grid-cols-2">
        <SelectField label="Device" value={device} onChange={(event) => onDeviceChange(event.target.value as HomeRoastDevice)}>
          {roastGuideDevices.map((each) => (
            <option key={each} value={each}>
              {homeRoastProfiles[each]?.name ?? each}
            </option>
          ))}
        </SelectField>
        <SelectField label="Roast level" value={level} onChange={(event) => onLevelChange(event.target.value as RoastLevel)}>
          {roastLevels.map((each) => (
            <option key={each} value={each}>
              {roastLevelLabels[each]}
            </option>
          ))}
        </SelectField>
      </div>

      {guide ? (
        <div className={clsx('mt-6 grid gap-8 lg:grid-cols-2', guideQuery.isPlaceholderData && 'opacity-60')} aria-busy={guideQuery.isPlaceholderData}>
          <div>
            <dl className="grid gap-3 sm:grid-cols-2">
              <div className="rounded-card border border-rule bg-sheet p-4">
                <dt className="text-small text-ink-muted">Batches for a {bagSizeLabel(size)} bag</dt>
                <dd className="text-h3 font-heading font-semibold">{guide.batches}</dd>
                <dd className="text-small">
                  of {formatLoads(guide.batchLoads, unit)} each (a usual load is {formatWeight(guide.batchGrams.min, unit)}–
                  {formatWeight(guide.batchGrams.max, unit)})
                </dd>
              </div>
              <div className="rounded-card border border-rule bg-sheet p-4">
                <dt className="text-small text-ink-muted">Expected roasted yield</dt>
                <dd className="text-h3 font-heading font-semibold">
                  {formatWeight(guide.expectedRoastedGrams.min, unit)}–{formatWeight(guide.expectedRoastedGrams.max, unit)}
                </dd>
                <dd className="text-small">
                  from {formatWeight(guide.greenGrams, unit)} green, losing {formatPercent(guide.expectedLossPct.min)}–
                  {formatPercent(guide.expectedLossPct.max)}
                </dd>
              </div>
            </dl>
            {guide.notes.length > 0 ? (
              <ul className="mt-4 list-disc space-y-1 pl-5 text-small">
                {guide.notes.map((note) => (
                  <li key={note}>{note}</li>
                ))}
              </ul>
            ) : null}

            <h3 className="mt-6 text-h3">Phases and their cues</h3>
            <ol className="mt-2 space-y-3">
              {guide.phases.map((phase, index) => (
                <li key={phase.name} className="flex gap-3">
                  <span aria-hidden="true" className="flex size-7 shrink-0 items-center justify-center rounded-pill bg-ember-wash font-semibold text-ember">
                    {index + 1}
                  </span>
                  <p>
                    <strong>{phase.name}.</strong> {phase.cue}
                  </p>
                </li>
              ))}
            </ol>
          </div>

          <div>
            <Table variant="prose">
              <caption className="text-left text-h3 font-heading font-semibold">Time after first crack</caption>
              <TableHead>
                <tr className="text-small text-ink-muted">
                  <TableHeader>Roast level</TableHeader>
                  <TableHeader>Keep roasting</TableHeader>
                </tr>
              </TableHead>
              <TableBody>
                {guide.levels.map((each) => (
                  <tr key={each.level} className={clsx(each.level === guide.level && 'bg-leaf-wash')}>
                    <TableRowHeader className="font-semibold">
                      {roastLevelLabels[each.level]} {each.suggested ? <Badge tone="ok">Suggested for this lot</Badge> : null}
                    </TableRowHeader>
                    <TableCell>{formatSeconds(each.afterFirstCrackSeconds)}</TableCell>
                  </tr>
                ))}
              </TableBody>
            </Table>
            <p className="mt-2 text-small text-ink-muted">Times are a starting point ({guide.source}); judge the colour by eye as well.</p>
          </div>
        </div>
      ) : guideQuery.isError ? (
        <div className="mt-6">
          <ErrorState title="The roast guide could not load" error={guideQuery.error} onRetry={() => void guideQuery.refetch()} />
        </div>
      ) : (
        <div className="mt-6 grid gap-3">
          <p role="status" className="sr-only">
            Loading the roast guide…
          </p>
          <Skeleton className="h-24" />
          <Skeleton className="h-40" />
        </div>
      )}
    </section>
  );
}
