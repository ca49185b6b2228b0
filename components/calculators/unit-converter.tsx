'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { TextField } from '@/components/ui/text-field';
import { RULES } from '@/lib/preserving/errors';
import { UNITS, UNIT_LABELS, convert } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const OPTIONS = UNITS.map((u) => ({ value: u, label: `${UNIT_LABELS[u]} (${u})` }));

/** Exact conversions between kitchen, metric, temperature and length units. */
export function UnitConverter({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [value, setValue] = useState('1');
  const [from, setFrom] = useState('cup');
  const [to, setTo] = useState('mL');
  const outcome = calculate((read) => convert(read.num(value, RULES.value), from, to), ['value', 'from', 'to']);
  return (
    <CalculatorShell
      title="Unit converter"
      intro="US cups, spoons, pints and quarts to millilitres, ounces and pounds to grams, °F to °C, feet to metres: exact by definition."
      headingLevel={headingLevel}
      lesson={LESSONS.salt}
      caution="A cup of salt or sugar is not a fixed weight: use the salt calculator, or a scale, to go from volume to weight."
      result={
        outcome.result !== undefined ? (
          <p className="text-xl font-bold" data-testid="convert-result">
            {fmt(Number(value.replace(/,/g, '')), 6)} {from} = {fmt(outcome.result, 6)} {to}
          </p>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <TextField
        label="Value"
        inputMode="decimal"
        autoComplete="off"
        value={value}
        onChange={(event) => setValue(event.target.value)}
        error={outcome.fieldErrors.value}
      />
      <Select label="From" options={OPTIONS} value={from} onChange={(event) => setFrom(event.target.value)} error={outcome.fieldErrors.from} />
      <Select label="To" options={OPTIONS} value={to} onChange={(event) => setTo(event.target.value)} error={outcome.fieldErrors.to} />
    </CalculatorShell>
  );
}
