'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { TextField } from '@/components/ui/text-field';
import { RULES } from '@/lib/preserving/errors';
import { BY_SPOON_NOTE } from '@/lib/preserving/salt';
import { SUGARS, SUGAR_KINDS, sugarToGrams } from '@/lib/preserving/sugar';
import { convert } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const SUGAR_OPTIONS = SUGAR_KINDS.map((k) => ({ value: k, label: SUGARS[k].name }));
const UNIT_OPTIONS = [
  { value: 'cup', label: 'cups (US)' },
  { value: 'tbsp', label: 'tablespoons (US)' },
  { value: 'tsp', label: 'teaspoons (US)' },
  { value: 'g', label: 'grams' },
  { value: 'kg', label: 'kilograms' },
  { value: 'oz', label: 'ounces' },
  { value: 'lb', label: 'pounds' },
];
const FIELDS = ['sugar', 'amount', 'unit', 'liquidMl'] as const;

/** Sugar by volume or weight to grams, and its share by weight of the pickling syrup. */
export function SugarCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [v, setV] = useState({ sugar: 'granulated', amount: '2', unit: 'cup', liquidMl: '' });
  const set = (key: keyof typeof v) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV({ ...v, [key]: event.target.value });
  const outcome = calculate(
    (read) => sugarToGrams({ sugar: v.sugar, amount: read.num(v.amount, RULES.sugarAmount), unit: v.unit, liquidMl: read.opt(v.liquidMl, RULES.liquidMl) }),
    FIELDS,
  );
  const e = outcome.fieldErrors;
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Sugar by weight"
      intro="Convert the sugar of a sweet-pickle recipe to grams, and see how much of the syrup it makes up by weight."
      headingLevel={headingLevel}
      lesson={LESSONS.salt}
      caution="Sugar adds flavour and firmness; it does not make a pickle safe. Never cut the vinegar to make room for more sugar, and use a tested reduced-sugar recipe if you want less sugar."
      result={
        r ? (
          <div className="space-y-2">
            <p className="text-xl font-bold" data-testid="sugar-grams">
              {r.byWeight ? '' : 'about '}
              {fmt(r.grams, 0)} g ({fmt(convert(r.grams, 'g', 'lb'), 2)} lb)
            </p>
            {r.byWeight ? null : (
              <p className="text-sm text-honey-700" data-testid="sugar-uncertainty">
                {BY_SPOON_NOTE} Grams per cup: {r.source}.
              </p>
            )}
            {r.syrupPct !== undefined ? <p>Sugar in the syrup: {fmt(r.syrupPct, 1)}% by weight</p> : null}
            <p className="text-sm text-brine-800">{r.why}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <Select label="Kind of sugar" options={SUGAR_OPTIONS} value={v.sugar} onChange={set('sugar')} error={e.sugar} />
      <TextField
        label="Amount of sugar"
        inputMode="decimal"
        autoComplete="off"
        value={v.amount}
        onChange={set('amount')}
        error={e.amount}
        hint="Fractions such as 4 1/2 work"
      />
      <Select label="Unit of sugar" options={UNIT_OPTIONS} value={v.unit} onChange={set('unit')} error={e.unit} />
      <TextField
        label="Vinegar and water (optional)"
        suffix="mL"
        inputMode="decimal"
        autoComplete="off"
        value={v.liquidMl}
        onChange={set('liquidMl')}
        error={e.liquidMl}
        hint="1 US cup = 237 mL"
      />
    </CalculatorShell>
  );
}
