import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { TableOfContents } from './table-of-contents';

describe('TableOfContents', () => {
  it('lists the h2 headings and nests each h3 under the h2 before it', () => {
    render(
      <TableOfContents
        entries={[
          { id: 'vinegar', text: 'Which vinegar to use', depth: 2 },
          { id: 'ratios', text: 'Ratios', depth: 3 },
          { id: 'ph', text: 'Measuring pH', depth: 2 },
        ]}
      />,
    );
    const nav = screen.getByRole('navigation', { name: 'In this lesson' });
    const top = within(nav).getAllByRole('list')[0];
    const items = within(top)
      .getAllByRole('listitem')
      .filter((li) => li.parentElement === top);
    expect(items).toHaveLength(2);
    expect(within(items[0]).getByRole('link', { name: 'Ratios' })).toHaveAttribute('href', '#ratios');
    expect(within(items[1]).queryByRole('link', { name: 'Ratios' })).toBeNull();
    expect(within(nav).getByRole('link', { name: 'Which vinegar to use' })).toHaveAttribute('href', '#vinegar');
    expect(within(nav).getByRole('link', { name: 'Measuring pH' })).toHaveAttribute('href', '#ph');
  });

  it('renders nothing for a lesson without headings', () => {
    const { container } = render(<TableOfContents entries={[]} />);
    expect(container).toBeEmptyDOMElement();
  });
});
