import { useState } from 'react';
import { grindLabels, grinds, type Grind } from '@shared/domain/vocabulary';
import type { SubscriberDetail } from '@shared/schemas/subscribers';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useActForSubscriber, type SubscriberAction } from '../api/act-for-subscriber';

const cadences = [1, 2, 3, 4] as const;

/**
 * Staff skipping, pausing or changing a subscription on the subscriber's behalf (a phone call, an
 * e-mail). The subscriber gets the same e-mail as when they change it themselves; the server audits who did it.
 */
export function ActForSubscriber({ subscriber }: { subscriber: SubscriberDetail }) {
  const act = useActForSubscriber();
  const [outcome, setOutcome] = useState<{ tone: 'status' | 'alert'; text: string }>();
  const [pauseUntil, setPauseUntil] = useState('');
  const [grind, setGrind] = useState<Grind>(subscriber.grind);
  const [cadenceWeeks, setCadenceWeeks] = useState(subscriber.cadenceWeeks);

  function run(action: SubscriberAction) {
    setOutcome(undefined);
    act
      .mutateAsync({ id: subscriber.id, action })
      .then((answer) => setOutcome({ tone: 'status', text: answer.notice || 'Nothing needed to change.' }))
      .catch((error: unknown) => setOutcome({ tone: 'alert', text: error instanceof Error ? error.message : 'That did not work.' }));
  }

  if (subscriber.status !== 'active' && subscriber.status !== 'paused') return null;
  return (
    <section aria-labelledby="act-for-subscriber" className="grid gap-4 rounded-card border border-rule bg-sheet p-4 sm:p-5">
      <div>
        <h2 id="act-for-subscriber" className="text-h3">
          Change for the subscriber
        </h2>
        <p className="text-small text-ink-muted">For when {subscriber.customer.name} asks you. They get the usual e-mail about the change.</p>
      </div>
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert> : null}
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" disabled={act.isPending} onClick={() => run({ kind: 'skip' })}>
          Skip the next delivery
        </Button>
        {subscriber.status === 'paused' ? (
          <Button variant="secondary" disabled={act.isPending} onClick={() => run({ kind: 'resume' })}>
            Resume deliveries
          </Button>
        ) : null}
      </div>
      {subscriber.status === 'active' ? (
        <form
          aria-label="Pause for the subscriber"
          className="flex flex-wrap items-end gap-3"
          onSubmit={(event) => {
            event.preventDefault();
            run({ kind: 'pause', body: { until: pauseUntil } });
          }}
        >
          <TextField label="Pause until" type="date" required value={pauseUntil} onChange={(event) => setPauseUntil(event.target.value)} />
          <Button type="submit" variant="secondary" disabled={act.isPending || pauseUntil === ''}>
            Pause
          </Button>
        </form>
      ) : null}
      <form
        aria-label="Change the coffee for the subscriber"
        className="flex flex-wrap items-end gap-3"
        onSubmit={(event) => {
          event.preventDefault();
          run({ kind: 'change', body: { grind, cadenceWeeks } });
        }}
      >
        <SelectField label="Grind" value={grind} onChange={(event) => setGrind(event.target.value as Grind)}>
          {grinds.map((each) => (
            <option key={each} value={each}>
              {grindLabels[each]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Every" value={cadenceWeeks} onChange={(event) => setCadenceWeeks(Number(event.target.value))}>
          {cadences.map((weeks) => (
            <option key={weeks} value={weeks}>
              {weeks === 1 ? '1 week' : `${weeks} weeks`}
            </option>
          ))}
        </SelectField>
        <Button type="submit" variant="secondary" disabled={act.isPending}>
          Save the change
        </Button>
      </form>
    </section>
  );
}
