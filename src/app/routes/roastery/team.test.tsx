// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { TeamMember, TeamResponse } from '@shared/schemas/team';
import { axeViolations } from '@/testing/axe';
import { apiErrorResponse, jsonResponse, makeUser, renderApp, sentRequests, stubFetch, enterValue } from '@/testing/test-utils';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// An invented team.
const owner = makeUser({ id: '1c4e6a8b-2d3f-4a5b-8c6d-7e8f9a0b1c2d', role: 'owner', name: 'Wren Calloway', email: 'wren@example.test' });
const ownerRow: TeamMember = { ...owner, disabled: false, joinedAt: '2026-03-02T15:00:00.000Z' };
const roaster: TeamMember = {
  id: '2d5f7b9c-3e4a-4b6c-9d7e-8f9a0b1c2d3e',
  email: 'oren.vale@example.test',
  name: 'Oren Vale',
  role: 'staff',
  disabled: false,
  joinedAt: '2026-05-11T14:00:00.000Z',
};

/** A tiny in-memory server for the owner's team routes. */
function teamServer(initial: TeamResponse) {
  const team = structuredClone(initial);
  return stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    if (method === 'GET') return jsonResponse(team);
    if (method === 'DELETE') {
      team.invitations = team.invitations.filter((invitation) => invitation.id !== url.pathname.split('/').pop());
      return new Response(null, { status: 204 });
    }
    const body = JSON.parse(String(init?.body)) as Record<string, unknown>;
    if (method === 'POST') {
      const invitation = {
        id: '3e6a8c0d-4f5b-4c7d-8e8f-9a0b1c2d3e4f',
        email: String(body.email),
        role: body.role as 'packer' | 'staff' | 'owner',
        invitedBy: owner.name,
        expiresAt: '2026-12-10T18:00:00.000Z',
      };
      team.invitations.push(invitation);
      return jsonResponse(invitation, 201);
    }
    const member = team.members.find((item) => item.id === url.pathname.split('/').pop()) as TeamMember;
    Object.assign(member, body);
    return jsonResponse(member);
  });
}

describe('Team page', () => {
  it('gives a team member the packer role, offered with what a packer may do', async () => {
    const fetchMock = teamServer({ members: [ownerRow, roaster], invitations: [] });
    renderApp('/roastery/team', { session: owner });

    const oren = await screen.findByRole('listitem', { name: 'Oren Vale' });
    const role = within(oren).getByLabelText('Role');
    expect(within(role).getByRole('option', { name: 'Packer: the Pack List, shipping and reading orders' })).toBeTruthy();
    enterValue(role, 'packer');
    fireEvent.click(within(oren).getByRole('button', { name: 'Change role' }));

    expect(await screen.findByText('Oren Vale is now packer.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PATCH', `/api/owner/team/${roaster.id}`)[0]?.body).toEqual({ role: 'packer' });
    await waitFor(() => expect(within(oren).getByText('Packer')).toBeTruthy());
    expect(await axeViolations()).toEqual([]);
  });

  it('lists the team with roles and access, and keeps the owner’s own row out of reach', async () => {
    teamServer({ members: [ownerRow, roaster], invitations: [] });
    renderApp('/roastery/team', { session: owner });

    const members = await screen.findByRole('list', { name: 'Team members' });
    const you = within(members).getByRole('listitem', { name: /Wren Calloway/ });
    expect(within(you).getByText('(you)')).toBeTruthy();
    expect(within(you).queryByRole('button')).toBeNull();
    const oren = within(members).getByRole('listitem', { name: 'Oren Vale' });
    expect(within(oren).getByText('Staff')).toBeTruthy();
    expect(within(oren).getByRole('button', { name: 'Disable access' })).toBeTruthy();
    expect(screen.getByText('No invitations are waiting for an answer.')).toBeTruthy();
  });

  it('invites someone by e-mail with a role and lists the invitation', async () => {
    const fetchMock = teamServer({ members: [ownerRow], invitations: [] });
    renderApp('/roastery/team', { session: owner });

    const form = await screen.findByRole('region', { name: 'Invite someone' });
    enterValue(within(form).getByLabelText('Their e-mail'), 'Juno.Reed@example.test');
    enterValue(within(form).getByLabelText('Role'), 'owner');
    fireEvent.click(within(form).getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByText('Invitation sent to juno.reed@example.test.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'POST', '/api/owner/team')[0]?.body).toEqual({ email: 'juno.reed@example.test', role: 'owner' });
    const invitations = await screen.findByRole('region', { name: 'Open invitations' });
    await waitFor(() => expect(within(invitations).getByText('juno.reed@example.test')).toBeTruthy());
    expect((within(form).getByLabelText('Their e-mail') as HTMLInputElement).value).toBe('');
  });

  it('withdraws an open invitation', async () => {
    const invitation = {
      id: '4f7b9d1e-5a6c-4d8e-9f0a-1b2c3d4e5f6a',
      email: 'juno.reed@example.test',
      role: 'staff' as const,
      invitedBy: owner.name,
      expiresAt: '2026-12-10T18:00:00.000Z',
    };
    const fetchMock = teamServer({ members: [ownerRow], invitations: [invitation] });
    renderApp('/roastery/team', { session: owner });

    const invitations = await screen.findByRole('region', { name: 'Open invitations' });
    expect(within(invitations).getByText(/sent by Wren Calloway/)).toBeTruthy();
    fireEvent.click(within(invitations).getByRole('button', { name: 'Withdraw' }));

    expect(await screen.findByText('The invitation to juno.reed@example.test is withdrawn; its link no longer works.')).toBeTruthy();
    await waitFor(() => expect(within(invitations).getByText('No invitations are waiting for an answer.')).toBeTruthy());
    expect(sentRequests(fetchMock, 'DELETE', `/api/owner/team/invitations/${invitation.id}`)).toHaveLength(1);
  });

  it('shows why an invitation was refused on the e-mail field', async () => {
    stubFetch((_url, init) =>
      (init?.method ?? 'GET') === 'GET'
        ? jsonResponse({ members: [ownerRow], invitations: [] })
        : apiErrorResponse(409, 'already_on_team', 'That person is already on the team.', { email: 'Already on the team.' }),
    );
    renderApp('/roastery/team', { session: owner });

    const form = await screen.findByRole('region', { name: 'Invite someone' });
    const email = within(form).getByLabelText('Their e-mail');
    enterValue(email, 'oren.vale@example.test');
    fireEvent.click(within(form).getByRole('button', { name: 'Send invitation' }));

    await waitFor(() => expect(email.getAttribute('aria-invalid')).toBe('true'));
    expect(within(form).getByText('Already on the team.')).toBeTruthy();
  });

  it('changes a role and turns access off and on again', async () => {
    const fetchMock = teamServer({ members: [ownerRow, roaster], invitations: [] });
    renderApp('/roastery/team', { session: owner });

    const oren = await screen.findByRole('listitem', { name: 'Oren Vale' });
    const change = within(oren).getByRole('button', { name: 'Change role' }) as HTMLButtonElement;
    expect(change.disabled).toBe(true);
    enterValue(within(oren).getByLabelText('Role'), 'owner');
    fireEvent.click(change);
    expect(await screen.findByText('Oren Vale is now owner.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PATCH', `/api/owner/team/${roaster.id}`)[0]?.body).toEqual({ role: 'owner' });

    fireEvent.click(within(oren).getByRole('button', { name: 'Disable access' }));
    expect(await screen.findByText('Oren Vale can no longer sign in.')).toBeTruthy();
    await waitFor(() => expect(within(oren).getByText('Access disabled')).toBeTruthy());
    fireEvent.click(within(oren).getByRole('button', { name: 'Restore access' }));
    expect(await screen.findByText('Oren Vale can sign in again.')).toBeTruthy();
    expect(sentRequests(fetchMock, 'PATCH', `/api/owner/team/${roaster.id}`).map((request) => request.body)).toEqual([
      { role: 'owner' },
      { disabled: true },
      { disabled: false },
    ]);
  });
});
