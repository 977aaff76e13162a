import { useEffect, useId, useRef, useState } from 'react';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { Subscription } from '@shared/schemas/subscriptions';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { UnpaidSubscriptionActions } from './unpaid-subscription-actions';
import { FormAlert } from '@/components/ui/form-alert';
import { useCancelSubscription } from '../api/cancel-subscription';
import { useSubscriptionDeliveries } from '../api/get-subscription-deliveries';
import { useResumeSubscription } from '../api/resume-subscription';
import { useSkipDelivery } from '../api/skip-delivery';
import { useUnskipDelivery } from '../api/unskip-delivery';
import { describeChangeError } from '../utils/change-errors';
import { subscriptionStatusLabels } from '@/lib/subscription-labels';
import { formatDayWithWeekday } from '@/lib/dates';
import { ChangeAddressForm } from './change-address-form';
import { ChangeSubscriptionForm } from './change-subscription-form';
import { PauseSubscriptionForm } from './pause-subscription-form';
import { SubscriptionSchedule } from './subscription-schedule';
import { SubscriptionSummary } from './subscription-summary';

type OpenForm = 'change' | 'pause' | 'address';
type Message = { tone: 'status' | 'alert'; text: string };

const formTitles: Record<OpenForm, string> = {
  change: 'Change what each delivery brings',
  pause: 'Pause deliveries',
  address: 'Change the shipping address',
};

function StatusNotice({ subscription }: { subscription: Subscription }) {
  if (subscription.status === 'past_due') {
    return (
      <FormAlert>
        The last payment did not go through, so the next delivery is held. Once the card is charged it roasts on the next open roast day; we have e-mailed you
        about it.
      </FormAlert>
    );
  }
  if (subscription.status === 'paused' && subscription.pausedUntil) {
    return <p className="text-small">Paused: no delivery roasts before {formatDayWithWeekday(subscription.pausedUntil)}.</p>;
  }
  if (subscription.cancelAtPeriodEnd && subscription.status !== 'cancelled') {
    return (
      <p className="text-small">
        Cancelled at the end of the paid period{subscription.endsOn ? `, on ${formatDayWithWeekday(subscription.endsOn)}` : ''}. Deliveries already paid for
        still roast and ship; nothing more is charged.
      </p>
    );
  }
  if (subscription.status === 'incomplete') {
    return <UnpaidSubscriptionActions subscription={subscription} />;
  }
  return null;
}

/**
 * One subscription on Deliveries: what it brings, its schedule, and everything the subscriber can
 * do to it. After each change the message below the heading takes the focus, so it is read out
 * and the keyboard stays in place even when the button pressed is gone.
 */
export function SubscriptionPanel({ subscription, allowedLevels }: { subscription: Subscription; allowedLevels: readonly RoastLevel[] }) {
  const headingId = useId();
  const [openForm, setOpenForm] = useState<OpenForm>();
  const [confirmingCancel, setConfirmingCancel] = useState(false);
  const [message, setMessage] = useState<Message>();
  const messageRef = useRef<HTMLDivElement>(null);
  const formHeadingRef = useRef<HTMLHeadingElement>(null);
  const triggerRef = useRef<HTMLButtonElement | null>(null);
  const deliveriesQuery = useSubscriptionDeliveries(subscription.id, { enabled: subscription.status !== 'incomplete' });
  const skip = useSkipDelivery();
  const unskip = useUnskipDelivery();
  const resume = useResumeSubscription();
  const cancel = useCancelSubscription();

  useEffect(() => {
    if (message) messageRef.current?.focus();
  }, [message]);
  useEffect(() => {
    if (openForm) formHeadingRef.current?.focus();
  }, [openForm]);

  const nextSkippable = deliveriesQuery.data?.items.find((delivery) => delivery.status === 'scheduled' && !delivery.locked);
  const status = subscriptionStatusLabels[subscription.status];
  const ended = subscription.status === 'cancelled' || subscription.status === 'incomplete';
  const busy = skip.isPending || unskip.isPending || resume.isPending || cancel.isPending;

  const open = (form: OpenForm, trigger: HTMLButtonElement) => {
    triggerRef.current = trigger;
    setMessage(undefined);
    setOpenForm(form);
  };
  const closeForm = () => {
    setOpenForm(undefined);
    triggerRef.current?.focus();
  };
  const finish = (text: string) => {
    setOpenForm(undefined);
    setMessage({ tone: 'status', text });
  };
  /** Runs a change; without a message of its own, the server's notice says what really happened (a skip's payment included). */
  const run = async (action: () => Promise<{ notice?: string } | unknown>, success?: string) => {
    setMessage(undefined);
    try {
      const changed = await action();
      const notice = changed && typeof changed === 'object' && 'notice' in changed && typeof changed.notice === 'string' ? changed.notice : undefined;
      setMessage({ tone: 'status', text: success ?? notice ?? 'Saved.' });
    } catch (error) {
      setMessage({ tone: 'alert', text: describeChangeError(error) });
    }
  };

  return (
    <section aria-labelledby={headingId} className="rounded-card border border-rule bg-sheet p-5 shadow-card sm:p-6">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id={headingId} className="text-h2">
          {subscription.coffee}
        </h2>
        <Badge tone={status.tone}>{status.label}</Badge>
      </div>
      <div className="mt-3 grid gap-3">
        <StatusNotice subscription={subscription} />
        <SubscriptionSummary subscription={subscription} />
      </div>

      <div ref={messageRef} tabIndex={-1} className="mt-4 empty:hidden focus:outline-none">
        {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      </div>

      {!ended ? (
        <div className="mt-4 flex flex-wrap gap-2" role="group" aria-label={`Change ${subscription.coffee}`}>
          {subscription.status === 'paused' ? (
            <Button
              disabled={busy}
              onClick={() => void run(() => resume.mutateAsync({ id: subscription.id }), 'Resumed: deliveries start again from the next open roast day.')}
            >
              Resume deliveries
            </Button>
          ) : nextSkippable ? (
            <Button
              variant="secondary"
              disabled={busy}
              onClick={() => void run(() => skip.mutateAsync({ id: subscription.id, roastDate: nextSkippable.roastDate }))}
            >
              Skip the delivery roasting {formatDayWithWeekday(nextSkippable.roastDate)}
            </Button>
          ) : null}
          {subscription.status !== 'paused' ? (
            <Button variant="secondary" aria-expanded={openForm === 'pause'} onClick={(event) => open('pause', event.currentTarget)} disabled={busy}>
              Pause until a date
            </Button>
          ) : null}
          <Button variant="secondary" aria-expanded={openForm === 'change'} onClick={(event) => open('change', event.currentTarget)} disabled={busy}>
            Change level, size, grind or cadence
          </Button>
          <Button variant="secondary" aria-expanded={openForm === 'address'} onClick={(event) => open('address', event.currentTarget)} disabled={busy}>
            Change the address
          </Button>
          {!subscription.cancelAtPeriodEnd ? (
            <Button
              variant="secondary"
              disabled={busy}
              onClick={(event) => {
                triggerRef.current = event.currentTarget;
                setMessage(undefined);
                setConfirmingCancel(true);
              }}
            >
              Cancel the subscription
            </Button>
          ) : null}
        </div>
      ) : null}

      {openForm ? (
        <div className="mt-5 rounded-card border border-rule-strong p-4 sm:p-5">
          <h3 ref={formHeadingRef} tabIndex={-1} className="mb-4 text-h3 focus:outline-none">
            {formTitles[openForm]}
          </h3>
          {openForm === 'change' ? (
            <ChangeSubscriptionForm subscription={subscription} allowedLevels={allowedLevels} onDone={finish} onCancel={closeForm} />
          ) : openForm === 'pause' ? (
            <PauseSubscriptionForm subscription={subscription} onDone={finish} onCancel={closeForm} />
          ) : (
            <ChangeAddressForm subscription={subscription} onDone={finish} onCancel={closeForm} />
          )}
        </div>
      ) : null}

      <h3 className="mt-6 mb-2 text-h3">Upcoming deliveries</h3>
      <SubscriptionSchedule
        subscription={subscription}
        actions={
          ended
            ? undefined
            : {
                busy,
                onSkip: (delivery) => void run(() => skip.mutateAsync({ id: subscription.id, roastDate: delivery.roastDate })),
                onUnskip: (delivery) => void run(() => unskip.mutateAsync({ id: subscription.id, roastDate: delivery.roastDate })),
              }
        }
      />

      <ConfirmDialog
        open={confirmingCancel}
        title="Cancel this subscription?"
        confirmLabel="Cancel at the end of the period"
        cancelLabel="Keep my subscription"
        busy={cancel.isPending}
        onCancel={() => setConfirmingCancel(false)}
        onConfirm={() => {
          setConfirmingCancel(false);
          void run(
            () => cancel.mutateAsync({ id: subscription.id }),
            'Cancelled at the end of the paid period. Deliveries already paid for still roast and ship; nothing more is charged.',
          );
        }}
      >
        Nothing more is charged. Deliveries already paid for still roast and ship, and you can start a new subscription any time.
      </ConfirmDialog>
    </section>
  );
}
