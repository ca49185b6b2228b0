import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { QuizRunner } from './quiz-runner';
import type { AttemptView } from './types';

const attempt: AttemptView = {
  id: 41,
  quizSlug: 'c--q',
  title: 'Acidity',
  courseSlug: 'c',
  lessonSlug: 'acidity',
  passMarkPct: 80,
  startedAt: '2026-12-01T00:00:00.000Z',
  deadlineAt: null,
  submittedAt: null,
  questions: [
    {
      id: 'one',
      kind: 'single',
      prompt: 'Which vinegar strength?',
      choices: [
        { id: 'c1', text: '2 percent' },
        { id: 'c2', text: '5 percent' },
      ],
    },
    { id: 'tf', kind: 'true-false', prompt: 'Homemade vinegar is fine.' },
    { id: 'num', kind: 'numeric', prompt: 'Minutes at 3,000 ft?', units: ['min'] },
  ],
};
const intro = { quizSlug: 'c--q', title: 'Acidity', description: null, questionCount: 3, timeLimitMinutes: null, attemptLimit: null };

let fetchMock: ReturnType<typeof vi.fn>;
beforeEach(() => {
  window.localStorage.clear();
  fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
    if (url.endsWith('/attempts')) return Response.json({ attempt }, { status: 201 });
    if (url.endsWith('/submit')) {
      const body = JSON.parse(String(init?.body));
      return Response.json({
        attempt: {
          ...attempt,
          submittedAt: '2026-12-01T00:05:00.000Z',
          result: {
            scorePct: 66.67,
            passed: false,
            correct: 2,
            total: 3,
            late: false,
            questions: [
              {
                id: 'one',
                correct: body.answers.one === 'c2',
                answered: true,
                given: [body.answers.one],
                right: { choices: ['c2'] },
                explanation: 'Tested recipes use 5 percent vinegar.',
              },
              { id: 'tf', correct: true, answered: true, given: false, right: { value: false }, explanation: 'Its strength is unknown.' },
              {
                id: 'num',
                correct: false,
                answered: false,
                given: null,
                right: { value: 15, unit: 'min', tolerance: { abs: 0 } },
                explanation: 'The table gives 15 minutes.',
              },
            ],
          },
        },
        graded: true,
      });
    }
    return new Response('{}', { status: 404 });
  });
  vi.stubGlobal('fetch', fetchMock);
});
afterEach(() => vi.unstubAllGlobals());

// user-event drives real typing and clicks; give each test room on a busy machine.
const SLOW = 30_000;

describe('QuizRunner', () => {
  it(
    'keeps answers in localStorage and restores them after a reload (a new mount)',
    async () => {
      const user = userEvent.setup();
      const first = render(<QuizRunner intro={intro} />);
      await user.click(screen.getByRole('button', { name: 'Start the quiz' }));
      await user.click(await screen.findByLabelText('5 percent'));
      await user.click(screen.getByLabelText('False'));
      await user.type(screen.getByLabelText('Your answer'), '15');
      await waitFor(() => expect(JSON.parse(window.localStorage.getItem('brinewright:attempt:41:answers')!).q.num.value).toBe('15'));
      first.unmount();

      render(<QuizRunner intro={intro} />);
      // The open attempt is resumed without a click, with the answers back in the form.
      expect(await screen.findByLabelText('5 percent')).toBeChecked();
      expect(screen.getByLabelText('False')).toBeChecked();
      expect(screen.getByLabelText('Your answer')).toHaveValue('15');
      expect(screen.getByText('3 of 3 answered')).toBeInTheDocument();
    },
    SLOW,
  );

  it(
    'refuses a non-number before sending, then submits the answers in the API shape and shows feedback',
    async () => {
      const user = userEvent.setup();
      render(<QuizRunner intro={intro} />);
      await user.click(screen.getByRole('button', { name: 'Start the quiz' }));
      await user.click(await screen.findByLabelText('5 percent'));
      await user.click(screen.getByLabelText('False'));
      await user.type(screen.getByLabelText('Your answer'), 'fifteen');
      await user.click(screen.getByRole('button', { name: 'Hand in my answers' }));
      expect(await screen.findByText('Enter a number, such as 15 or 2.5.')).toBeInTheDocument();
      expect(screen.getByLabelText('Your answer')).toHaveAttribute('aria-invalid', 'true');
      expect(fetchMock.mock.calls.filter(([u]) => String(u).endsWith('/submit'))).toHaveLength(0);

      await user.clear(screen.getByLabelText('Your answer'));
      await user.click(screen.getByRole('button', { name: 'Hand in my answers' }));
      const result = await screen.findByTestId('quiz-result');
      const submitCall = fetchMock.mock.calls.find(([u]) => String(u).endsWith('/submit'))!;
      expect(JSON.parse(String(submitCall[1]!.body))).toEqual({ answers: { one: 'c2', tf: false } });
      expect(result).toHaveTextContent('Not passed yet: 66.67 %');
      expect(result).toHaveTextContent('The table gives 15 minutes.');
      expect(result).toHaveTextContent('15 minutes');
      expect(window.localStorage.getItem('brinewright:attempt:41:answers')).toBeNull();
    },
    SLOW,
  );

  it(
    'shows the next allowed time when the attempt limit is reached',
    async () => {
      fetchMock.mockImplementationOnce(async () =>
        Response.json(
          {
            error: 'rate_limit',
            message: 'You have used the 3 attempts allowed in 24 hours. You may try again from 2026-12-02T10:00:00.000Z.',
            nextAttemptAt: '2026-12-02T10:00:00.000Z',
          },
          { status: 429 },
        ),
      );
      const user = userEvent.setup();
      render(<QuizRunner intro={intro} />);
      await user.click(screen.getByRole('button', { name: 'Start the quiz' }));
      expect(await screen.findByRole('alert')).toHaveTextContent(`You may try again on ${new Date('2026-12-02T10:00:00.000Z').toLocaleString()}.`);
    },
    SLOW,
  );
});
