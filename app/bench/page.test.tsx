import { render, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import BenchPage, { dynamic } from './page';

// user-event typing is slow on a loaded two-core machine: allow more than the default 5 s.
vi.setConfig({ testTimeout: 30_000 });

describe('Brine bench page', () => {
  it('is static and shows every calculator under its own heading with a lesson link, and the safety caution', () => {
    expect(dynamic).toBe('force-static');
    render(<BenchPage />);
    expect(screen.getByRole('heading', { level: 1, name: 'Brine bench' })).toBeInTheDocument();
    expect(screen.getByRole('note', { name: 'Safety' })).toHaveTextContent('They never call a recipe safe.');
    const names = [
      'Brine acidity',
      'Salt by weight and brine strength',
      'Sugar by weight',
      'Headspace check',
      'Processing time by altitude',
      'Pressure canner by altitude',
      'Boiling point of water',
      'Crisping agents',
      'Batch planner',
      'Unit converter',
    ];
    expect(screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent)).toEqual(names);
    for (const name of names) {
      const section = screen.getByRole('region', { name });
      expect(
        within(section)
          .getByRole('link', { name: /^Lesson: / })
          .getAttribute('href'),
      ).toMatch(/^\/learn\//);
    }
    // The page's table of contents points at each calculator.
    const nav = screen.getByRole('navigation', { name: 'Calculators on this page' });
    for (const link of within(nav).getAllByRole('link')) expect(document.querySelector(link.getAttribute('href')!)).not.toBeNull();
  });
});
