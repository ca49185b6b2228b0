import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { ToastProvider } from '@/components/ui/toast';
import { FetchError, postJson } from '@/lib/fetcher';
import type { WorkshopInput } from '@/lib/validations/workshop';
import { WorkshopForm } from './workshop-form';

const refresh = vi.fn();
vi.mock('next/navigation', () => ({ useRouter: () => ({ push: vi.fn(), refresh }) }));
// The form's one way to the server; the real FetchError, so the form reads the server's field errors from it.
vi.mock('@/lib/fetcher', async (importOriginal) => ({ ...(await importOriginal<typeof import('@/lib/fetcher')>()), postJson: vi.fn() }));
const post = vi.mocked(postJson);

const defaults: WorkshopInput = {
  courseId: '1',
  date: '',
  startTime: '09:00',
  endTime: '14:00',
  timeZone: 'America/Denver',
  place: '',
  seats: 12,
  instructorId: '',
  attendanceRequired: true,
};

function renderForm() {
  render(
    <ToastProvider>
      <WorkshopForm
        workshopId={null}
        defaults={defaults}
        courses={[{ id: 1, title: 'Safe Pickling and Water-Bath Canning' }]}
        instructors={[{ id: 3, name: 'Tomas Lindqvist' }]}
      />
    </ToastProvider>,
  );
}

describe('WorkshopForm', () => {
  it('shows the shared schema’s messages tied to their fields and does not call the server', async () => {
    post.mockReset();
    renderForm();
    await userEvent.click(screen.getByRole('button', { name: 'Add workshop' }));
    const place = screen.getByLabelText('Place');
    expect(await screen.findByText('Enter the place (at least 3 characters).')).toBeInTheDocument();
    expect(place).toHaveAttribute('aria-invalid', 'true');
    expect(place.getAttribute('aria-describedby')).toMatch(/-error/);
    expect(screen.getByText('Enter the date as YYYY-MM-DD.')).toBeInTheDocument();
    expect(post).not.toHaveBeenCalled();
  }, 20_000);

  it('sends the values and shows the server’s field errors', async () => {
    post.mockReset();
    post.mockRejectedValue(
      new FetchError(400, {
        error: 'bad_request',
        message: 'Please check the highlighted fields.',
        fields: { seats: ['3 seats are already taken; the workshop cannot have fewer.'] },
      }),
    );
    renderForm();
    await userEvent.type(screen.getByLabelText('Date'), '2027-03-13');
    await userEvent.type(screen.getByLabelText('Place'), 'Cedar Hollow Grange Hall');
    await userEvent.selectOptions(screen.getByLabelText('Instructor'), '3');
    await userEvent.click(screen.getByRole('button', { name: 'Add workshop' }));
    expect(await screen.findByText('3 seats are already taken; the workshop cannot have fewer.')).toBeInTheDocument();
    expect(screen.getByLabelText('Seats')).toHaveAttribute('aria-invalid', 'true');
    expect(post).toHaveBeenCalledWith(
      '/api/desk/workshops',
      expect.objectContaining({
        courseId: 1,
        date: '2027-03-13',
        place: 'Cedar Hollow Grange Hall',
        seats: 12,
        instructorId: 3,
        timeZone: 'America/Denver',
        attendanceRequired: true,
      }),
    );
  }, 20_000);
});
