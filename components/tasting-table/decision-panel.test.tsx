import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { REFUSAL } from '@/lib/practicals/decision-rights';

const refresh = vi.fn();
vi.mock('next/navigation', () => ({ useRouter: () => ({ refresh }) }));
vi.mock('@/components/ui/toast', () => ({ useToast: () => ({ show: vi.fn() }) }));

const { DecisionPanel } = await import('./decision-panel');

const instructor = { id: 7, roles: ['instructor' as const] };

describe('DecisionPanel', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    refresh.mockClear();
  });

  it('shows the rubric to someone who may decide, and no claim button', () => {
    render(<DecisionPanel practicalId={3} round={1} right={{ may: true, as: 'workshop instructor' }} claim={null} viewer={instructor} />);
    expect(screen.getByRole('form', { name: 'Review of the first batch' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Claim this submission' })).toBeNull();
  });

  it('says why not and offers the claim, which posts and refreshes the page', async () => {
    const fetchMock = vi.fn(async () => Response.json({ claim: { practicalId: 3, claimedById: 7 } }, { status: 201 }));
    vi.stubGlobal('fetch', fetchMock);
    render(<DecisionPanel practicalId={3} round={1} right={{ may: false, reason: 'claim_first' }} claim={null} viewer={instructor} />);
    expect(screen.getByText(REFUSAL.claim_first)).toBeInTheDocument();
    expect(screen.queryByRole('form')).toBeNull();
    await userEvent.click(screen.getByRole('button', { name: 'Claim this submission' }));
    await waitFor(() => expect(refresh).toHaveBeenCalled());
    expect(fetchMock).toHaveBeenCalledWith('/api/practicals/3/claim', expect.objectContaining({ method: 'POST' }));
  });

  it('names the claimant to others, and lets a coordinator release the claim; a refusal is shown', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ error: 'conflict', message: 'Nobody has claimed this submission.' }, { status: 409 })),
    );
    render(
      <DecisionPanel
        practicalId={3}
        round={1}
        right={{ may: false, reason: 'claimed_by_other' }}
        claim={{ byId: 8, byName: 'Alder Finch' }}
        viewer={instructor}
      />,
    );
    expect(screen.getByText('Claimed by Alder Finch.')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Release the claim' })).toBeNull();
    render(
      <DecisionPanel
        practicalId={3}
        round={1}
        right={{ may: true, as: 'coordinator' }}
        claim={{ byId: 8, byName: 'Alder Finch' }}
        viewer={{ id: 2, roles: ['coordinator'] }}
      />,
    );
    await userEvent.click(screen.getByRole('button', { name: 'Release the claim' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('Nobody has claimed this submission.');
    expect(refresh).not.toHaveBeenCalled();
  });
});
