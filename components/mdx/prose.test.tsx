import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { Caution, H2, KeyPoint, MdxLink, proseElements, Source } from './prose';

describe('MDX prose elements', () => {
  it('a heading with an id links to itself and keeps its level', () => {
    render(<H2 id="the-ph-line">The pH 4.6 line</H2>);
    const heading = screen.getByRole('heading', { level: 2, name: 'The pH 4.6 line' });
    expect(heading).toHaveAttribute('id', 'the-ph-line');
    expect(screen.getByRole('link', { name: 'The pH 4.6 line' })).toHaveAttribute('href', '#the-ph-line');
  });

  it('a top-level heading in a lesson becomes an h2, since the page title is the h1', () => {
    const H1 = proseElements.h1;
    render(<H1 id="x">Inside a lesson</H1>);
    expect(screen.getByRole('heading', { level: 2, name: 'Inside a lesson' })).toBeInTheDocument();
  });

  it('internal links stay in the app, external links are marked noopener', () => {
    render(
      <>
        <MdxLink href="/bench">the Brine bench</MdxLink>
        <MdxLink href="https://nchfp.uga.edu/">the center</MdxLink>
      </>,
    );
    const internal = screen.getByRole('link', { name: 'the Brine bench' });
    expect(internal).toHaveAttribute('href', '/bench');
    expect(internal).not.toHaveAttribute('rel');
    expect(screen.getByRole('link', { name: 'the center' })).toHaveAttribute('rel', 'noopener noreferrer');
  });

  it('styles elements that the Tailwind reset leaves bare', () => {
    const Ul = proseElements.ul;
    const Table = proseElements.table;
    render(
      <>
        <Ul>
          <li>one</li>
        </Ul>
        <Table>
          <tbody>
            <tr>
              <td>10</td>
            </tr>
          </tbody>
        </Table>
      </>,
    );
    expect(screen.getByRole('list')).toHaveClass('list-disc');
    // Wide tables scroll inside a focusable region instead of breaking the page.
    expect(screen.getByRole('region', { name: 'Table' })).toHaveAttribute('tabindex', '0');
  });

  it('Caution and KeyPoint are named notes, Source is a citation line', () => {
    render(
      <>
        <Caution title="Hot glass">Let the jars cool.</Caution>
        <KeyPoint>Never dilute the vinegar.</KeyPoint>
        <Source>USDA Complete Guide to Home Canning, 2015.</Source>
      </>,
    );
    expect(screen.getByRole('note', { name: 'Hot glass' })).toHaveTextContent('Let the jars cool.');
    expect(screen.getByRole('note', { name: 'Key point' })).toHaveTextContent('Never dilute the vinegar.');
    expect(screen.getByText('Source:').parentElement).toHaveTextContent('Source: USDA Complete Guide to Home Canning, 2015.');
  });
});
