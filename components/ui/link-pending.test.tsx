import { render } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';

const status = vi.hoisted(() => ({ pending: false }));
vi.mock('next/link', async (importOriginal) => ({ ...(await importOriginal<typeof import('next/link')>()), useLinkStatus: () => status }));

const { LinkPending } = await import('./link-pending');

describe('LinkPending', () => {
  it('shows nothing while no navigation waits, and a hidden-from-readers bar while one does', () => {
    status.pending = false;
    const idle = render(<LinkPending />);
    expect(idle.container.querySelector('[data-link-pending]')).toBeNull();
    idle.unmount();
    status.pending = true;
    const { container } = render(<LinkPending />);
    const bar = container.querySelector('[data-link-pending]');
    expect(bar).not.toBeNull();
    expect(bar).toHaveAttribute('aria-hidden', 'true');
    expect(bar).toHaveClass('absolute', 'link-pending');
  });
});
