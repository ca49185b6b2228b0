import { act, render, screen } from '@testing-library/react';
import { hydrateRoot } from 'react-dom/client';
import { renderToString } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { BrineCalculator } from '@/components/calculators';
import { SubmitButton } from './submit-button';

/** Puts the server's HTML in the document, checks it, then hydrates it as the browser would. */
async function serverThenHydrate(element: React.ReactElement) {
  const container = document.createElement('div');
  container.innerHTML = renderToString(element);
  document.body.appendChild(container);
  const before = container.cloneNode(true) as HTMLElement;
  const root = await act(async () => hydrateRoot(container, element));
  return { before, after: container, unmount: () => act(() => root.unmount()) };
}

describe('fields and submit buttons wait for hydration', () => {
  it('a submit button is disabled in the server HTML and enabled once hydrated', async () => {
    const { before, after, unmount } = await serverThenHydrate(<SubmitButton>Sign in</SubmitButton>);
    expect(before.querySelector('button')).toBeDisabled();
    expect(before.querySelector('button')).toHaveAttribute('type', 'submit');
    expect(after.querySelector('button')).toBeEnabled();
    await unmount();
  });

  it('a submit button first rendered in the browser is enabled at once, and stays disabled when asked', () => {
    render(
      <>
        <SubmitButton>Save</SubmitButton>
        <SubmitButton disabled>Locked</SubmitButton>
      </>,
    );
    expect(screen.getByRole('button', { name: 'Save' })).toBeEnabled();
    expect(screen.getByRole('button', { name: 'Locked' })).toBeDisabled();
  });

  it("a calculator's fields take no typing in the server HTML and do once hydrated", async () => {
    const { before, after, unmount } = await serverThenHydrate(<BrineCalculator />);
    const inputs = (root: HTMLElement) => [...root.querySelectorAll('input')];
    expect(inputs(before).length).toBeGreaterThan(2);
    expect(inputs(before).every((input) => input.matches(':disabled'))).toBe(true);
    expect(inputs(after).every((input) => input.matches(':enabled'))).toBe(true);
    await unmount();
  });
});
