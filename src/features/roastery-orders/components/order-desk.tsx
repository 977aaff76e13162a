import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';
import type { OrderDetail, ResendableTemplate } from '@shared/schemas/orders';
import { orderAddressCorrectionSchema } from '@shared/schemas/orders';
import { AddressFields, addressFieldPaths, addressFormValues } from '@/components/address/address-fields';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { TextAreaField } from '@/components/ui/text-area-field';
import { applyServerErrors } from '@/lib/form-errors';
import { orderActions, useOrderAction } from '../api/act-on-order';
import { RefundForm } from './refund-form';

type Outcome = { tone: 'status' | 'alert'; text: string };

const failureText = (error: unknown) => (error instanceof Error ? error.message : 'That did not work. Please try again.');

function DeskSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="grid gap-3 border-t border-rule pt-4 first:border-t-0 first:pt-0">
      <h3 id={id} className="text-body font-semibold">
        {title}
      </h3>
      {children}
    </section>
  );
}

function CancelUnpaid({ order }: { order: OrderDetail }) {
  const cancel = useOrderAction(orderActions.cancel);
  const [confirming, setConfirming] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>();
  return (
    <>
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert> : null}
      <p className="text-small text-ink-muted">Not paid yet: cancelling puts its bags back in stock. Nothing was charged.</p>
      <div>
        <Button variant="secondary" onClick={() => setConfirming(true)}>
          Cancel the order
        </Button>
      </div>
      <ConfirmDialog
        open={confirming}
        title="Cancel this unpaid order?"
        confirmLabel={cancel.isPending ? 'Cancelling…' : 'Cancel the order'}
        cancelLabel="Keep the order"
        busy={cancel.isPending}
        onConfirm={() =>
          void cancel
            .mutateAsync({ id: order.id })
            .then(() => setOutcome({ tone: 'status', text: 'The order is cancelled and its bags are back in stock.' }))
            .catch((error: unknown) => setOutcome({ tone: 'alert', text: failureText(error) }))
            .finally(() => setConfirming(false))
        }
        onCancel={() => setConfirming(false)}
      >
        The customer’s order is cancelled and its bags go back on sale.
      </ConfirmDialog>
    </>
  );
}

const resendLabels: Record<ResendableTemplate, string> = {
  'order-confirmed': 'Order confirmation',
  roasted: 'Roasted notice',
  shipped: 'Shipped notice with tracking',
};

/** The e-mails this order has had, by what has happened to it. */
function sentTemplates(order: OrderDetail): ResendableTemplate[] {
  const sent: ResendableTemplate[] = [];
  if (order.paidAt) sent.push('order-confirmed');
  if (order.kind === 'roasted' && ['roasted', 'packed', 'shipped'].includes(order.status)) sent.push('roasted');
  if (order.shippedAt) sent.push('shipped');
  return sent;
}

function ResendEmails({ order }: { order: OrderDetail }) {
  const resend = useOrderAction(orderActions.resend);
  const [outcome, setOutcome] = useState<Outcome>();
  const templates = sentTemplates(order);
  if (templates.length === 0) return <p className="text-small text-ink-muted">No e-mail about this order has gone out yet.</p>;
  return (
    <>
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert> : null}
      <ul className="flex flex-wrap gap-3">
        {templates.map((template) => (
          <li key={template}>
            <Button
              variant="secondary"
              disabled={resend.isPending}
              onClick={() =>
                void resend
                  .mutateAsync({ id: order.id, template })
                  .then(() => setOutcome({ tone: 'status', text: `${resendLabels[template]} sent again to ${order.customer.email}.` }))
                  .catch((error: unknown) => setOutcome({ tone: 'alert', text: failureText(error) }))
              }
            >
              Send again: {resendLabels[template]}
            </Button>
          </li>
        ))}
      </ul>
    </>
  );
}

type AddressFormFields = z.input<typeof orderAddressCorrectionSchema>;

function CorrectAddress({ order }: { order: OrderDetail }) {
  const correct = useOrderAction(orderActions.correctAddress);
  const [open, setOpen] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>();
  const form = useForm<AddressFormFields, unknown, z.output<typeof orderAddressCorrectionSchema>>({
    resolver: zodResolver(orderAddressCorrectionSchema),
    defaultValues: addressFormValues(order.shippingAddress),
  });
  const submit = form.handleSubmit(async (address) => {
    try {
      await correct.mutateAsync({ id: order.id, address });
      setOutcome({ tone: 'status', text: 'The address is corrected; the label prints the new one.' });
      setOpen(false);
    } catch (error) {
      const message = applyServerErrors(error, form.setError, addressFieldPaths());
      if (message) setOutcome({ tone: 'alert', text: message });
    }
  });
  return (
    <>
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert> : null}
      {open ? (
        <FormProvider {...form}>
          <form aria-label="Correct the address" noValidate className="grid gap-4" onSubmit={(event) => void submit(event)}>
            <AddressFields />
            <div className="flex flex-wrap gap-3">
              <Button type="submit" disabled={form.formState.isSubmitting}>
                {form.formState.isSubmitting ? 'Saving…' : 'Save the address'}
              </Button>
              <Button variant="secondary" onClick={() => setOpen(false)}>
                Cancel
              </Button>
            </div>
          </form>
        </FormProvider>
      ) : (
        <div>
          <Button variant="secondary" onClick={() => setOpen(true)}>
            Correct the address
          </Button>
        </div>
      )}
    </>
  );
}

function StaffNote({ order }: { order: OrderDetail }) {
  const save = useOrderAction(orderActions.saveNote);
  const [note, setNote] = useState(order.staffNote ?? '');
  const [outcome, setOutcome] = useState<Outcome>();
  return (
    <form
      aria-label="Staff note"
      noValidate
      className="grid gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        void save
          .mutateAsync({ id: order.id, note })
          .then(() => setOutcome({ tone: 'status', text: 'Note saved.' }))
          .catch((error: unknown) => setOutcome({ tone: 'alert', text: failureText(error) }));
      }}
    >
      {outcome ? <FormAlert tone={outcome.tone}>{outcome.text}</FormAlert> : null}
      <TextAreaField
        label="Note for the team"
        hint="Only staff see it; the customer never does."
        value={note}
        maxLength={2000}
        onChange={(event) => setNote(event.target.value)}
      />
      <div>
        <Button type="submit" variant="secondary" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save the note'}
        </Button>
      </div>
    </form>
  );
}

const beforeShipping = ['pending_payment', 'paid', 'held', 'roasted', 'packed'];

/** What staff can do to one order from its page; the refund is the owner's. */
export function OrderDesk({ order, canRefund }: { order: OrderDetail; canRefund: boolean }) {
  return (
    <div className="grid gap-4">
      {canRefund && order.paidAt ? (
        <DeskSection id="desk-refund" title="Refund">
          <RefundForm order={order} />
        </DeskSection>
      ) : null}
      {order.status === 'pending_payment' && order.kind === 'green' ? (
        <DeskSection id="desk-cancel" title="Cancel">
          <CancelUnpaid order={order} />
        </DeskSection>
      ) : null}
      <DeskSection id="desk-resend" title="E-mails to the customer">
        <ResendEmails order={order} />
      </DeskSection>
      {beforeShipping.includes(order.status) ? (
        <DeskSection id="desk-address" title="Shipping address">
          <CorrectAddress order={order} />
        </DeskSection>
      ) : null}
      <DeskSection id="desk-note" title="Staff note">
        <StaffNote order={order} />
      </DeskSection>
    </div>
  );
}
