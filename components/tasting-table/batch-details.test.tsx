import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { computeExpectations } from '@/lib/practicals/checks';
import type { PracticalDetails } from '@/lib/validations/practical';
import { BatchDetails } from './batch-details';

const cells = (label: string) => {
  const row = screen.getByRole('rowheader', { name: label }).closest('tr')!;
  return within(row)
    .getAllByRole('cell')
    .map((cell) => cell.textContent);
};

describe('BatchDetails', () => {
  it('shows a full batch beside the published numbers', () => {
    const details: PracticalDetails = {
      product: 'fresh-pack-dill-pickles',
      recipeTitle: 'Quick fresh-pack dill pickles',
      recipeSource: 'USDA Complete Guide, Guide 6',
      jar: 'pint',
      jars: 7,
      pack: 'raw',
      vinegarAcidityPct: 5,
      vinegarMl: 1420,
      waterMl: 1893,
      headspaceIn: 0.5,
      method: 'boiling-water',
      altitudeFt: 5200,
      minutes: 15,
      batchDate: '2026-11-28',
      sealedJars: 7,
      unsealedJars: 0,
      notes: '',
    } as PracticalDetails;
    render(<BatchDetails details={details} expected={computeExpectations(details)} />);
    expect(cells('Tested recipe')[0]).toBe('Quick fresh-pack dill pickles, USDA Complete Guide, Guide 6');
    expect(cells('Vinegar')[0]).toBe('1420 mL at 5 % acidity');
    expect(cells('Seals')[0]).toBe('7 sealed, 0 not sealed');
    // USDA Complete Guide to Home Canning (2015), Guide 6, quick fresh-pack dill pickles: pints 15 min at 1,001-6,000 ft.
    expect(cells('Minutes processed')).toEqual(['15 min', '15 min in boiling water for 1,001–6,000 ft']);
    // The brine beside its product's tested liquid (6 cups 5 % vinegar to 8 cups water: 2.14 %), never a pH.
    expect(cells('Water')).toEqual(['1893 mL', 'tested liquid 2.14 % acetic acid or more (this brine 2.14 %)']);
  });

  it('gives one dash for a value none of whose parts was stored, not one per part', () => {
    // An older row: only some fields were stored.
    const details = { product: 'fresh-pack-dill-pickles', jar: 'pint', jars: 7, altitudeFt: 5200 } as Partial<PracticalDetails>;
    render(<BatchDetails details={details} expected={computeExpectations(details)} />);
    for (const label of ['Tested recipe', 'Vinegar', 'Water', 'Headspace measured', 'Minutes processed', 'Seals']) expect(cells(label)[0]).toBe('—');
    expect(cells('Jars')[0]).toBe('7 × pint');
  });
});
