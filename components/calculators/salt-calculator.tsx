'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { TextField } from '@/components/ui/text-field';
import { RULES } from '@/lib/preserving/errors';
import { BY_SPOON_NOTE, SALTS, SALT_KINDS, saltToGrams } from '@/lib/preserving/salt';
import { convert } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const SALT_OPTIONS = SALT_KINDS.map((k) => ({ value: k, label: SALTS[k].name }));
const UNIT_OPTIONS = [
  { value: 'tsp', label: 'teaspoons (US)' },
  { value: 'tbsp', label: 'tablespoons (US)' },
  { value: 'cup', label: 'cups (US)' },
  { value: 'mL', label: 'millilitres' },
  { value: 'g', label: 'grams' },
  { value: 'kg', label: 'kilograms' },
  { value: 'oz', label: 'ounces' },
  { value: 'lb', label: 'pounds' },
];
const FIELDS = ['salt', 'amount', 'unit', 'waterMl'] as const;

/** Salt by volume or weight to grams, brine strength by weight, and whether the salt suits pickling. */
export function SaltCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [v, setV] = useState({ salt: 'canning', amount: '3', unit: 'tbsp', waterMl: '1000' });
  const set = (key: keyof typeof v) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV({ ...v, [key]: event.target.value });
  const outcome = calculate(
    (read) => saltToGrams({ salt: v.salt, amount: read.num(v.amount, RULES.amount), unit: v.unit, waterMl: read.opt(v.waterMl, RULES.waterMl) }),
    FIELDS,
  );
  const e = outcome.fieldErrors;
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Salt by weight and brine strength"
      intro="Spoons of different salts hold different weights. Convert to grams and see the brine strength by weight."
      headingLevel={headingLevel}
      lesson={LESSONS.salt}
      caution="Salt amounts by volume vary by brand and crystal: weigh salt when you can, and never cut the salt of a fermented recipe."
      result={
        r ? (
          <div className="space-y-2">
            {r.byWeight || r.gramsRange[0] === r.gramsRange[1] ? (
              <p className="text-xl font-bold" data-testid="salt-grams">
                {fmt(r.grams, 1)} g ({fmt(convert(r.grams, 'g', 'oz'), 2)} oz){r.byWeight ? '' : ', approximately'}
              </p>
            ) : (
              <p className="text-xl font-bold" data-testid="salt-grams">
                about {fmt(r.gramsRange[0], 1)} to {fmt(r.gramsRange[1], 1)} g ({fmt(convert(r.gramsRange[0], 'g', 'oz'), 2)} to{' '}
                {fmt(convert(r.gramsRange[1], 'g', 'oz'), 2)} oz)
              </p>
            )}
            {r.brinePct !== undefined ? (
              <p data-testid="salt-brine">
                Brine strength:{' '}
                {r.brinePctRange && r.brinePctRange[0] !== r.brinePctRange[1]
                  ? `${fmt(r.brinePctRange[0], 2)} to ${fmt(r.brinePctRange[1], 2)}`
                  : fmt(r.brinePct, 2)}
                % salt by weight
              </p>
            ) : null}
            {r.byWeight ? null : (
              <p className="text-sm text-honey-700" data-testid="salt-uncertainty">
                {BY_SPOON_NOTE} Grams per teaspoon: {r.source}.
              </p>
            )}
            <p className={r.suitable ? 'text-sm text-brine-800' : 'text-sm font-medium text-beet-700'}>{r.why}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <Select label="Kind of salt" options={SALT_OPTIONS} value={v.salt} onChange={set('salt')} error={e.salt} />
      <TextField
        label="Amount of salt"
        inputMode="decimal"
        autoComplete="off"
        value={v.amount}
        onChange={set('amount')}
        error={e.amount}
        hint="Fractions such as 1/2 work"
      />
      <Select label="Unit" options={UNIT_OPTIONS} value={v.unit} onChange={set('unit')} error={e.unit} />
      <TextField
        label="Water (optional)"
        suffix="mL"
        inputMode="decimal"
        autoComplete="off"
        value={v.waterMl}
        onChange={set('waterMl')}
        error={e.waterMl}
        hint="1 US quart = 946 mL"
      />
    </CalculatorShell>
  );
}
