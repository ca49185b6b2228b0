import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SWRConfig } from 'swr';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CourseWorkshops, type WorkshopItem } from './course-workshops';

const base: WorkshopItem = {
  id: 7,
  courseSlug: 'pickling-and-canning',
  // 16:00 UTC is 9:00 MST (UTC−7) in Denver in December (IANA tz database).
  startsAt: '2026-12-12T16:00:00.000Z',
  endsAt: '2026-12-12T21:00:00.000Z',
  timeZone: 'America/Denver',
  place: 'Cedar Hollow Grange Hall',
  seats: 12,
  seatsLeft: 5,
  instructorName: 'Tomas Lindqvist',
  attendanceRequired: true,
  myStatus: null,
};

function renderFresh() {
  return render(
    <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>
      <CourseWorkshops courseSlug="pickling-and-canning" />
    </SWRConfig>,
  );
}

const answer = (status: number, body: unknown) =>
  Promise.resolve(new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } }));

afterEach(() => vi.unstubAllGlobals());

describe('CourseWorkshops', () => {
  it('shows a loading state, then each workshop in its own time zone with seats left and instructor', async () => {
    const fetchMock = vi.fn(() => answer(200, { workshops: [base, { ...base, id: 8, seatsLeft: 0 }] }));
    vi.stubGlobal('fetch', fetchMock);
    renderFresh();
    expect(screen.getByLabelText('Loading workshops')).toHaveAttribute('aria-busy', 'true');
    await screen.findAllByRole('heading', { name: 'Saturday, December 12, 2026' });
    const items = screen.getAllByRole('listitem');
    expect(fetchMock).toHaveBeenCalledWith('/api/courses/pickling-and-canning/workshops', expect.anything());
    const first = within(items[0]);
    expect(first.getByRole('heading', { name: 'Saturday, December 12, 2026' })).toBeInTheDocument();
    expect(first.getByText('9:00 AM – 2:00 PM MST')).toBeInTheDocument();
    expect(first.getByText('5 of 12 seats left')).toBeInTheDocument();
    expect(first.getByText('Instructor: Tomas Lindqvist')).toBeInTheDocument();
    expect(first.getByRole('button', { name: 'Enroll in this workshop' })).toBeEnabled();
    expect(within(items[1]).getByText('Full')).toBeInTheDocument();
    expect(within(items[1]).getByRole('button', { name: 'Workshop full' })).toBeDisabled();
  });

  it('says so when there are no workshops, and offers a retry when loading fails', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(() => answer(200, { workshops: [] })),
    );
    const { unmount } = renderFresh();
    expect(await screen.findByText(/No workshops are scheduled for this course yet/)).toBeInTheDocument();
    unmount();

    const failing = vi.fn(() => answer(503, { message: 'Brinewright cannot reach its database right now.' }));
    vi.stubGlobal('fetch', failing);
    renderFresh();
    expect(await screen.findByRole('alert')).toHaveTextContent('Brinewright cannot reach its database right now.');
    failing.mockImplementation(() => answer(200, { workshops: [base] }));
    await userEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByText('5 of 12 seats left')).toBeInTheDocument();
  });

  it('shows the server’s answer when the workshop filled up meanwhile, and sends a waiver code when given', async () => {
    const fetchMock = vi.fn((url: string, init?: RequestInit) => {
      if (url === '/api/enrollments')
        return answer(409, { error: 'conflict', reason: 'full', message: 'This workshop is full. Please choose another date.', body: init?.body });
      return answer(200, { workshops: [base] });
    });
    vi.stubGlobal('fetch', fetchMock);
    renderFresh();
    await userEvent.click(await screen.findByRole('button', { name: 'I have a fee waiver code' }));
    await userEvent.type(screen.getByLabelText('Fee waiver code'), 'CEDAR-VOLUNTEER');
    await userEvent.click(screen.getByRole('button', { name: 'Enroll in this workshop' }));
    expect(await screen.findByText('This workshop is full. Please choose another date.')).toBeInTheDocument();
    const call = fetchMock.mock.calls.find(([url]) => url === '/api/enrollments')!;
    expect(JSON.parse(String(call[1]!.body))).toEqual({ workshopId: 7, waiverCode: 'CEDAR-VOLUNTEER' });
  });
});
