import { render, screen } from '@testing-library/react';
import { SWRConfig } from 'swr';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { buildShelf } from '@/lib/progress/shelf';
import { PantryShelves } from './pantry-shelves';

const shelf = buildShelf({
  slug: 'pickling-and-canning',
  title: 'Safe Pickling and Water-Bath Canning',
  status: 'active',
  finalExam: 'pickling-and-canning--final-exam',
  lessons: [
    { slug: 'why', title: 'Why preserving is a safety job', order: 1, quiz: 'pickling-and-canning--why' },
    { slug: 'acidity', title: 'Acidity', order: 2, quiz: 'pickling-and-canning--acidity' },
  ],
  read: { why: '2026-12-01T00:00:00Z', acidity: '2026-12-01T00:00:00Z' },
  passedQuizzes: ['pickling-and-canning--acidity'],
});

const renderFresh = () =>
  render(
    <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>
      <PantryShelves />
    </SWRConfig>,
  );
afterEach(() => vi.unstubAllGlobals());

describe('PantryShelves', () => {
  it('draws a jar per lesson with its accessible name and fill, and the next step', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ shelves: [shelf] })),
    );
    renderFresh();
    const full = await screen.findByRole('img', { name: 'Acidity: read, quiz passed' });
    expect(full).toHaveAttribute('data-fill', '1');
    expect(screen.getByRole('img', { name: 'Why preserving is a safety job: read, quiz not passed yet' })).toHaveAttribute('data-fill', '0.5');
    expect(screen.getByRole('link', { name: 'Take the quiz for lesson 1: Why preserving is a safety job' })).toHaveAttribute(
      'href',
      '/quiz/pickling-and-canning--why',
    );
    expect(screen.getByText(/1 of 2 jars full/)).toBeInTheDocument();
  }, 20_000);

  it('shows the shelves the page read on the server at once, and a shelf-sized placeholder without them', async () => {
    let answer: (r: Response) => void = () => undefined;
    vi.stubGlobal(
      'fetch',
      vi.fn(() => new Promise<Response>((resolve) => (answer = resolve))),
    );
    const { unmount } = render(
      <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>
        <PantryShelves initial={{ shelves: [shelf] }} />
      </SWRConfig>,
    );
    // No loading state: the jars are there on the first render, before the route answers.
    expect(screen.getByRole('img', { name: 'Acidity: read, quiz passed' })).toHaveAttribute('data-fill', '1');
    expect(screen.queryByRole('status')).toBeNull();
    unmount();
    renderFresh();
    const placeholder = screen.getByRole('status');
    expect(placeholder).toHaveTextContent('Opening your Pantry…');
    expect(placeholder.querySelectorAll('.h-28')).toHaveLength(9);
    answer(Response.json({ shelves: [shelf] }));
    await screen.findByRole('img', { name: 'Acidity: read, quiz passed' });
  }, 20_000);

  it('an empty Pantry points to the courses; an error offers a retry', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ shelves: [] })),
    );
    const { unmount } = renderFresh();
    expect(await screen.findByRole('link', { name: 'Browse courses' })).toHaveAttribute('href', '/courses');
    unmount();
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ error: 'unavailable', message: 'Brinewright cannot reach its database right now.' }, { status: 503 })),
    );
    renderFresh();
    expect(await screen.findByRole('alert')).toHaveTextContent('Brinewright cannot reach its database right now.');
    expect(screen.getByRole('button', { name: 'Try again' })).toBeInTheDocument();
  }, 20_000);
});
