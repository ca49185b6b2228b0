'use client';

import { useState } from 'react';
import { planBatch } from '@/lib/preserving/batch';
import { RULES } from '@/lib/preserving/errors';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt, kitchen } from './parts';
import { JarSelect, ProductSelect, startProduct, JarsField } from './product-fields';

const UNIT_WORDS: Record<string, [string, string]> = {
  lb: ['lb', 'lb'],
  cup: ['cup', 'cups'],
  tbsp: ['tbsp', 'tbsp'],
  tsp: ['tsp', 'tsp'],
  gallon: ['gallon', 'gallons'],
  head: ['head', 'heads'],
  clove: ['clove', 'cloves'],
  stick: ['stick', 'sticks'],
  whole: ['', ''],
};

/** Produce, brine and other ingredients for N jars, scaled from the tested recipe, with extra brine. */
export function BatchPlanner({ defaultProduct, headingLevel }: { defaultProduct?: string; headingLevel?: 2 | 3 }) {
  const [product, setProduct] = useState(startProduct(defaultProduct));
  const [jar, setJar] = useState('pint');
  const [jars, setJars] = useState('7');
  const outcome = calculate((read) => planBatch({ product, jar, jars: read.num(jars, RULES.jars) }), ['product', 'jar', 'jars']);
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Batch planner"
      intro="Scale a tested recipe to the jars you have. Scaling changes amounts only, never the recipe's proportions or processing time."
      headingLevel={headingLevel}
      lesson={LESSONS.headspace}
      caution="Make the brine in the recipe's proportions; do not stretch it with extra water. Plan a canner load the canner can hold."
      result={
        r ? (
          <div className="space-y-2">
            <p className="text-xl font-bold" data-testid="batch-summary">
              {r.produceLb !== null ? `${fmt(r.produceLb, 2)} lb (${fmt(r.produceKg ?? 0, 2)} kg) of produce, ` : ''}
              {fmt(r.brineMl, 0)} mL ({fmt(r.brineMl / 236.5882365, 1)} cups) of brine
            </p>
            <p className="text-sm text-ink-soft">
              The brine includes {r.extraPct}% extra for spills and topping up (common practice, not part of the tested recipe).
            </p>
            <ul className="list-disc space-y-0.5 pl-5 text-sm">
              {r.ingredients.map((i) => {
                const [one, many] = UNIT_WORDS[i.unit];
                return (
                  <li key={i.name}>
                    {kitchen(i.amount)} {i.amount === 1 ? one : many} {i.name}
                    {i.metric ? ` (${fmt(i.metric.amount, 2)} ${i.metric.unit})` : ''}
                  </li>
                );
              })}
            </ul>
            {r.sterilizeJars ? (
              <p className="text-sm font-medium text-beet-700" data-testid="batch-sterilize">
                {r.sterilizeJars.message} <span className="block text-xs font-normal text-ink-soft">Source: {r.sterilizeJars.source}</span>
              </p>
            ) : null}
            <p className="text-xs text-ink-soft">Scaled from: {r.source}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <ProductSelect value={product} onChange={setProduct} error={outcome.fieldErrors.product} />
      <JarSelect value={jar} onChange={setJar} error={outcome.fieldErrors.jar} />
      <JarsField value={jars} onChange={setJars} error={outcome.fieldErrors.jars} />
    </CalculatorShell>
  );
}
