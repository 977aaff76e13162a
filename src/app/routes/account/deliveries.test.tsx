// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Subscription } from '@shared/schemas/subscriptions';
import {
  apiErrorResponse,
  jsonResponse,
  makeLotDetail,
  makeSubscription as makeSubscriptionWith,
  makeSubscriptionDelivery,
  makeUser,
  renderApp,
  requestedUrls,
  sentRequests,
  stubFetch,
  enterValue,
} from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const subscriptionId = '5a7c9e1b-3d5f-4a6b-8c9d-0e1f2a3b4c5d';

// Invented deliveries of an invented lot: the first is past its cutoff, the second is the next open one.
const makeDelivery = makeSubscriptionDelivery;

const lockedDelivery = makeDelivery({
  roastDate: '2026-12-02',
  shipDate: '2026-12-03',
  readyFrom: '2026-12-07',
  bestBefore: '2026-12-30',
  locked: true,
  cutoffAt: '2026-12-01T19:00:00Z',
});
const nextDelivery = makeDelivery();
const laterDelivery = makeDelivery({
  roastDate: '2026-12-16',
  shipDate: '2026-12-17',
  readyFrom: '2026-12-21',
  bestBefore: '2027-01-13',
  expectedArrival: '2026-12-18',
  readyOnArrival: false,
  cutoffAt: '2026-12-15T19:00:00Z',
});

const makeSubscription = (overrides: Partial<Subscription> = {}) => makeSubscriptionWith({ nextDelivery: lockedDelivery, ...overrides });

/** The subscription as it is after the change (with the server's notice, when the test gives one), or a refusal. */
type Answer = (body: Record<string, unknown>) => (Subscription & { notice?: string }) | Response;

/**
 * Answers like the server: the subscription list, its deliveries, the lot, and each change through
 * `onChange` (keyed by the action: skip, pause, resume, cancel, patch).
 */
function deliveriesServer(onChange: Partial<Record<string, Answer>> = {}, initialDeliveries = [lockedDelivery, nextDelivery, laterDelivery]) {
  let subscription = makeSubscription();
  let deliveries = initialDeliveries;
  const fetchMock = stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    if (url.pathname === '/api/lots/RD-T01') return jsonResponse(makeLotDetail({ allowedLevels: ['light', 'medium'] }));
    if (method === 'GET' && url.pathname === '/api/subscriptions') return jsonResponse({ items: [subscription] });
    if (method === 'GET' && url.pathname.endsWith('/deliveries')) return jsonResponse({ items: deliveries });
    const segments = url.pathname.split('/');
    const action = method === 'PATCH' ? 'patch' : (segments.pop() ?? '');
    const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as Record<string, unknown>) : {};
    // `/deliveries/:date/skip` and `/unskip` name the delivery in the path.
    if (action === 'skip' || action === 'unskip') body.roastDate ??= segments.pop();
    const answer = onChange[action];
    if (!answer) return apiErrorResponse(500, 'unexpected', `No answer for ${method} ${url.pathname}`);
    const answered = answer(body);
    if (answered instanceof Response) return answered;
    const { notice = 'Saved.', ...changed } = answered;
    subscription = changed;
    if (action === 'skip') deliveries = deliveries.map((each) => (each.roastDate === body.roastDate ? { ...each, status: 'skipped' } : each));
    if (action === 'unskip') deliveries = deliveries.map((each) => (each.roastDate === body.roastDate ? { ...each, status: 'scheduled' } : each));
    if (action === 'patch') deliveries = deliveries.map((each) => (each.locked ? each : { ...each, ...body }));
    return jsonResponse({ ...subscription, notice });
  });
  return { fetchMock };
}

describe('Deliveries page', () => {
  it('shows each delivery’s four dates and says a locked one is past its cutoff', async () => {
    deliveriesServer();
    renderApp('/account/deliveries', { session: makeUser() });

    const schedule = await screen.findByRole('table', { name: 'Upcoming deliveries of Test Ridge Washed' }, { timeout: 15_000 });
    const rows = within(schedule).getAllByRole('row');
    expect(rows).toHaveLength(4);
    const locked = within(schedule).getByRole('row', { name: /Wed, Dec 2, 2026/ });
    expect(locked.textContent).toContain('Thu, Dec 3, 2026');
    expect(locked.textContent).toContain('Mon, Dec 7, 2026');
    expect(locked.textContent).toContain('Wed, Dec 30, 2026');
    expect(within(locked).getByText('Locked')).toBeTruthy();
    expect(locked.textContent).toMatch(/Past its cutoff .*it roasts as it is, and changes reach the next delivery/);
    expect(within(schedule).getByRole('row', { name: /Wed, Dec 9, 2026/ }).textContent).not.toContain('Locked');
    expect(screen.getByRole('link', { name: 'Deliveries' }).getAttribute('aria-current')).toBe('page');
  });

  it('says when each delivery should arrive and whether it lands ready to brew', async () => {
    deliveriesServer();
    renderApp('/account/deliveries', { session: makeUser() });

    const schedule = await screen.findByRole('table', { name: 'Upcoming deliveries of Test Ridge Washed' }, { timeout: 15_000 });
    const next = within(schedule).getByRole('row', { name: /Wed, Dec 9, 2026/ });
    expect(next.textContent).toContain('Tue, Dec 15, 2026');
    expect(next.textContent).toContain('Ready to brew on arrival');
    const later = within(schedule).getByRole('row', { name: /Wed, Dec 16, 2026/ });
    expect(later.textContent).toContain('Fri, Dec 18, 2026');
    expect(later.textContent).toContain('Arrives before it is ready');
  });

  it('skips the next open delivery, not the locked one, says what the server did, and the schedule shows it at once', async () => {
    const notice = 'Skipped the delivery roasting Wednesday, December 9, 2026. It will not be roasted, shipped or charged.';
    const { fetchMock } = deliveriesServer({ skip: () => ({ ...makeSubscription({ nextDelivery: lockedDelivery }), notice }) });
    renderApp('/account/deliveries', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: 'Skip the delivery roasting Wed, Dec 9, 2026' }, { timeout: 15_000 }));

    const message = await screen.findByText(notice);
    expect(message.closest('[role="status"]')).toBeTruthy();
    const [skip] = sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/deliveries/2026-12-09/skip`);
    expect(skip).toBeDefined();
    expect(skip?.headers.get('X-Restday-Client')).toBe('web');
    const skipped = await screen.findByRole('row', { name: /Dec 9, 2026.*Skipped|Skipped/ });
    expect(skipped.textContent).toContain('Wed, Dec 9, 2026');
    // The schedule is read twice: on load and after the change (the skip itself is a POST under /deliveries/:date).
    expect(requestedUrls(fetchMock).filter((url) => url.startsWith(`/api/subscriptions/${subscriptionId}/deliveries`) && !url.endsWith('/skip'))).toHaveLength(
      2,
    );
  });

  it('marks paid deliveries, skips a later one from its own row and undoes it', async () => {
    const paidNext = makeDelivery({ orderId: '0b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e', paid: true });
    const { fetchMock } = deliveriesServer(
      {
        skip: () => ({
          ...makeSubscription(),
          notice: 'Skipped the delivery roasting Wednesday, December 16, 2026. It will not be roasted, shipped or charged.',
        }),
        unskip: () => ({
          ...makeSubscription(),
          notice: 'The delivery roasting Wednesday, December 16, 2026 is back on. It is charged like any other delivery.',
        }),
      },
      [lockedDelivery, paidNext, laterDelivery],
    );
    renderApp('/account/deliveries', { session: makeUser() });
    const schedule = await screen.findByRole('table', { name: 'Upcoming deliveries of Test Ridge Washed' }, { timeout: 15_000 });
    expect(within(within(schedule).getByRole('row', { name: /Wed, Dec 9, 2026/ })).getByText('Paid')).toBeTruthy();
    expect(within(within(schedule).getByRole('row', { name: /Wed, Dec 16, 2026/ })).queryByText('Paid')).toBeNull();
    // The locked one has no skip: it roasts as it is.
    expect(within(within(schedule).getByRole('row', { name: /Wed, Dec 2, 2026/ })).queryByRole('button')).toBeNull();

    fireEvent.click(within(schedule).getByRole('button', { name: 'Skip the delivery of Wed, Dec 16, 2026' }));
    expect(await screen.findByText(/Skipped the delivery roasting Wednesday, December 16, 2026/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/deliveries/2026-12-16/skip`)).toHaveLength(1);

    const undo = await screen.findByRole('button', { name: 'Undo skip of the delivery of Wed, Dec 16, 2026' });
    fireEvent.click(undo);
    expect(await screen.findByText(/is back on/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/deliveries/2026-12-16/unskip`)).toHaveLength(1);
  });

  it('says why a skip was refused when the delivery locked meanwhile, and changes nothing', async () => {
    deliveriesServer({ skip: () => apiErrorResponse(409, 'delivery_locked', 'The delivery roasting Dec 9 is past its cutoff.') });
    renderApp('/account/deliveries', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: /Skip the delivery roasting/ }, { timeout: 15_000 }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('The delivery roasting Dec 9 is past its cutoff.');
    expect(alert.textContent).toContain('roasts as it is; nothing was changed');
    expect(screen.queryByText('Skipped')).toBeNull();
  });

  it('changes the roast level among the lot’s levels, sending only what changed', async () => {
    const { fetchMock } = deliveriesServer({ patch: (body) => makeSubscription({ ...body }) });
    renderApp('/account/deliveries', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: 'Change level, size, grind or cadence' }, { timeout: 15_000 }));
    const form = await screen.findByRole('form', { name: 'Change what each delivery brings' });
    await waitFor(() => expect(document.activeElement?.textContent).toBe('Change what each delivery brings'));
    const levels = within(form).getByRole('group', { name: 'Roast level' });
    expect(
      within(levels)
        .getAllByRole('radio')
        .map((radio) => radio.getAttribute('value')),
    ).toEqual(['light', 'medium']);
    fireEvent.click(within(levels).getByRole('radio', { name: 'Medium' }));
    fireEvent.click(within(form).getByRole('button', { name: 'Save the changes' }));

    expect(await screen.findByText(/Your subscription is changed/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'PATCH', `/api/subscriptions/${subscriptionId}`).map((request) => request.body)).toEqual([{ roastLevel: 'medium' }]);
    expect(screen.queryByRole('form', { name: 'Change what each delivery brings' })).toBeNull();
    await waitFor(() => expect(screen.getByText('Medium', { selector: 'dd' })).toBeTruthy());
    // The locked delivery keeps its level; the next one brings the new one.
    const schedule = screen.getByRole('table', { name: 'Upcoming deliveries of Test Ridge Washed' });
    await waitFor(() => expect(within(schedule).getByRole('row', { name: /Wed, Dec 9, 2026/ }).textContent).toContain('2 × 12 oz bags, Medium, Whole bean'));
    expect(within(schedule).getByRole('row', { name: /Wed, Dec 2, 2026/ }).textContent).toContain('2 × 12 oz bags, Light, Whole bean');
  });

  it('shows the server’s reason on the field it concerns', async () => {
    deliveriesServer({
      patch: () => apiErrorResponse(422, 'level_not_allowed', 'Check the highlighted fields.', { roastLevel: 'This lot is not roasted to medium.' }),
    });
    renderApp('/account/deliveries', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: 'Change level, size, grind or cadence' }, { timeout: 15_000 }));
    const form = await screen.findByRole('form', { name: 'Change what each delivery brings' });
    fireEvent.click(within(form).getByRole('radio', { name: 'Medium' }));
    fireEvent.click(within(form).getByRole('button', { name: 'Save the changes' }));

    const reason = await within(form).findByText('This lot is not roasted to medium.');
    const group = within(form).getByRole('group', { name: 'Roast level' });
    expect(group.getAttribute('aria-describedby')).toContain(reason.id);
    expect(group.getAttribute('aria-invalid')).toBe('true');
  });

  it('pauses until a date and then offers to resume', async () => {
    const { fetchMock } = deliveriesServer({
      pause: (body) => ({ ...makeSubscription({ status: 'paused', pausedUntil: String(body.until) }), notice: 'Paused until Monday, January 11, 2027.' }),
      resume: () => makeSubscription(),
    });
    renderApp('/account/deliveries', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: 'Pause until a date' }, { timeout: 15_000 }));
    const form = await screen.findByRole('form', { name: 'Pause deliveries' });
    fireEvent.click(within(form).getByRole('button', { name: 'Pause deliveries' }));
    expect(await within(form).findByText('Use a day to resume like 2026-12-01.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/pause`)).toHaveLength(0);

    enterValue(within(form).getByLabelText('Pause until'), '2027-01-11');
    fireEvent.click(within(form).getByRole('button', { name: 'Pause deliveries' }));

    expect(await screen.findByText('Paused until Monday, January 11, 2027.', { selector: '[role="status"] *' })).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/pause`)[0]?.body).toEqual({ until: '2027-01-11' });

    fireEvent.click(screen.getByRole('button', { name: 'Resume deliveries' }));
    expect(await screen.findByText(/Resumed: deliveries start again/)).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/resume`)).toHaveLength(1);
  });

  it('asks ship or hold when a paid delivery lies inside the pause, and sends the choice', async () => {
    const question =
      'The delivery roasting Wednesday, December 9, 2026 is already paid. Ship it as planned, or hold it for the first delivery after the pause?';
    const { fetchMock } = deliveriesServer({
      pause: (body) =>
        body.paidDelivery
          ? {
              ...makeSubscription({ status: 'paused', pausedUntil: String(body.until) }),
              notice: 'Paused until Monday, January 11, 2027. The paid delivery roasting Wednesday, December 9, 2026 is held.',
            }
          : apiErrorResponse(409, 'paid_delivery_in_pause', question, { paidDelivery: 'Choose ship or hold.' }),
    });
    renderApp('/account/deliveries', { session: makeUser() });

    fireEvent.click(await screen.findByRole('button', { name: 'Pause until a date' }, { timeout: 15_000 }));
    const form = await screen.findByRole('form', { name: 'Pause deliveries' });
    enterValue(within(form).getByLabelText('Pause until'), '2027-01-11');
    fireEvent.click(within(form).getByRole('button', { name: 'Pause deliveries' }));

    const group = await within(form).findByRole('group', { name: 'A paid delivery falls inside the pause' });
    expect(group.textContent).toContain(question);
    expect(
      within(group)
        .getAllByRole('radio')
        .map((radio) => radio.getAttribute('value')),
    ).toEqual(['ship', 'hold']);
    fireEvent.click(within(group).getByRole('radio', { name: /Hold it for after the pause/ }));
    fireEvent.click(within(form).getByRole('button', { name: 'Pause deliveries' }));

    expect(await screen.findByText(/is held/, { selector: '[role="status"] *' })).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/pause`).map((request) => request.body)).toEqual([
      { until: '2027-01-11' },
      { until: '2027-01-11', paidDelivery: 'hold' },
    ]);
  });

  it('asks before cancelling, keeps the subscription on “keep”, and cancels at period end on confirm', async () => {
    const { fetchMock } = deliveriesServer({ cancel: () => makeSubscription({ cancelAtPeriodEnd: true, endsOn: '2026-12-15' }) });
    renderApp('/account/deliveries', { session: makeUser() });

    const cancelButton = await screen.findByRole('button', { name: 'Cancel the subscription' }, { timeout: 15_000 });
    cancelButton.focus();
    fireEvent.click(cancelButton);
    const dialog = await screen.findByRole('dialog', { name: 'Cancel this subscription?' });
    expect(document.activeElement?.textContent).toBe('Keep my subscription');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Keep my subscription' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(document.activeElement).toBe(cancelButton);
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/cancel`)).toHaveLength(0);

    fireEvent.click(cancelButton);
    fireEvent.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Cancel at the end of the period' }));

    expect(await screen.findByText(/Cancelled at the end of the paid period\. Deliveries already paid for/, { selector: '[role="status"] *' })).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', `/api/subscriptions/${subscriptionId}/cancel`)).toHaveLength(1);
    expect(screen.getByText(/on Tue, Dec 15, 2026/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Cancel the subscription' })).toBeNull();
  });

  it('invites a customer with no subscription to build one', async () => {
    stubFetch(() => jsonResponse({ items: [] }));
    renderApp('/account/deliveries', { session: makeUser() });

    expect(await screen.findByRole('heading', { name: 'No subscriptions yet' }, { timeout: 15_000 })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Build a Roasted to Order subscription' }).getAttribute('href')).toBe('/subscribe');
  });
});
