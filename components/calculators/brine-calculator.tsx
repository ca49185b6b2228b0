'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { TextField } from '@/components/ui/text-field';
import { PH_CAUTION_PLAIN, PH_METHOD, PRODUCE_WATER_SOURCE, brineAcidity } from '@/lib/preserving/acidity';
import { RULES } from '@/lib/preserving/errors';
import { PRODUCT_OPTIONS, WEAKEST_TESTED, isProductId } from '@/lib/preserving/products';
import { convert } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const FIELDS = ['vinegarMl', 'vinegarAcidityPct', 'waterMl', 'otherMl', 'produceG', 'produceWaterPct', 'product'] as const;
const ANY = '';
const COMPARE_OPTIONS = [{ value: ANY, label: `No product: the weakest tested liquid (${WEAKEST_TESTED.product.name.toLowerCase()})` }, ...PRODUCT_OPTIONS];

/** Acetic acid of a brine against a tested recipe's liquid, the liquid's pH before the produce, and the acid once produce water mixes in. */
export function BrineCalculator({ headingLevel, defaultProduct }: { headingLevel?: 2 | 3; defaultProduct?: string }) {
  const [v, setV] = useState({
    product: defaultProduct && isProductId(defaultProduct) ? defaultProduct : ANY,
    vinegarMl: '750',
    vinegarAcidityPct: '5',
    waterMl: '750',
    otherMl: '',
    produceG: '',
    produceWaterPct: '',
  });
  const set = (key: keyof typeof v) => (event: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setV({ ...v, [key]: event.target.value });
  const outcome = calculate(
    (read) =>
      brineAcidity({
        vinegarMl: read.num(v.vinegarMl, RULES.vinegarMl),
        vinegarAcidityPct: read.num(v.vinegarAcidityPct, RULES.vinegarAcidityPct),
        waterMl: read.num(v.waterMl, RULES.waterMl),
        otherMl: read.opt(v.otherMl, RULES.otherMl),
        produceG: read.opt(v.produceG, RULES.produceG),
        produceWaterPct: read.opt(v.produceWaterPct, RULES.produceWaterPct),
        product: v.product === ANY ? undefined : v.product,
      }),
    FIELDS,
  );
  const e = outcome.fieldErrors;
  const r = outcome.result;
  const totalMl = (Number(v.vinegarMl) || 0) + (Number(v.waterMl) || 0) + (Number(v.otherMl) || 0);
  return (
    <CalculatorShell
      title="Brine acidity"
      intro="How much acetic acid a vinegar and water mix holds, compared with the liquid of a tested recipe Brinewright knows."
      headingLevel={headingLevel}
      lesson={LESSONS.acidity}
      caution="Never dilute the vinegar of a tested recipe. Matching a tested liquid's strength does not make a recipe safe: follow the tested recipe in full."
      result={
        r ? (
          <div className="space-y-2">
            <p className="text-sm font-semibold" data-testid="brine-meaning">
              {r.belowTested
                ? `This liquid is weaker than ${r.tested.weakest ? 'any tested liquid Brinewright knows' : 'the tested recipe’s liquid'}: do not use it in place of the recipe’s own.`
                : `This liquid holds at least as much acid as ${r.tested.weakest ? 'the weakest tested liquid Brinewright knows' : 'the tested recipe’s liquid'}. That is arithmetic only: follow the tested recipe in full.`}
            </p>
            {r.warnings.length ? (
              <ul className="list-disc space-y-1 pl-5 text-sm font-medium text-beet-700" data-testid="brine-warnings">
                {r.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            ) : null}
            <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
              <div>
                <dt className="text-sm text-ink-soft">Acetic acid in the liquid</dt>
                <dd className="text-xl font-bold" data-testid="brine-acid">
                  {fmt(r.aceticAcidPct, 2)} g per 100 mL
                </dd>
              </div>
              <div>
                <dt className="text-sm text-ink-soft">{r.tested.weakest ? 'Weakest tested liquid Brinewright knows' : 'Tested liquid of this product'}</dt>
                <dd data-testid="brine-tested">
                  {fmt(r.tested.aceticAcidPct, 2)} g per 100 mL, {r.tested.name.toLowerCase()}
                  {r.belowTested ? <strong className="block text-beet-700">This liquid is weaker.</strong> : null}
                </dd>
              </div>
              <div>
                <dt className="text-sm text-ink-soft">Share of vinegar</dt>
                <dd>
                  {fmt(r.vinegarShare * 100, 1)}% of {fmt(totalMl, 0)} mL ({fmt(convert(totalMl, 'mL', 'cup'), 2)} US cups)
                </dd>
              </div>
              <div>
                <dt className="text-sm text-ink-soft">pH of the liquid before the produce goes in (estimate)</dt>
                <dd data-testid="brine-ph">
                  {fmt(r.estimatedPh, 2)} <span className="block text-xs text-honey-700">{PH_CAUTION_PLAIN}</span>
                </dd>
              </div>
              {r.equilibratedAcidityPct !== undefined ? (
                <div>
                  <dt className="text-sm text-ink-soft">Acid once the produce water mixes in</dt>
                  <dd data-testid="brine-equilibrated">{fmt(r.equilibratedAcidityPct, 2)} g per 100 mL (no pH is given: the produce buffers the acid)</dd>
                </div>
              ) : null}
            </dl>
            <details className="text-xs text-ink-soft">
              <summary className="cursor-pointer text-sm font-semibold text-brine-800">How this is worked out</summary>
              <p className="mt-1">
                Acetic acid is the vinegar&apos;s share of the liquid times its strength. The pH comes from the {PH_METHOD}. Tested liquid: {r.tested.source}
                {r.tested.confidence === 'memory' ? ' (from memory, not yet confirmed)' : ''}. Dissolved sugar is not counted in the volume, here or in the
                tested liquid.
              </p>
            </details>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <Select label="Compare with" options={COMPARE_OPTIONS} value={v.product} onChange={set('product')} error={e.product} className="sm:col-span-2" />
      <TextField
        label="Vinegar"
        suffix="mL"
        inputMode="decimal"
        autoComplete="off"
        value={v.vinegarMl}
        onChange={set('vinegarMl')}
        error={e.vinegarMl}
        hint="1 US cup = 236.6 mL"
      />
      <TextField
        label="Vinegar acidity"
        suffix="%"
        inputMode="decimal"
        autoComplete="off"
        value={v.vinegarAcidityPct}
        onChange={set('vinegarAcidityPct')}
        error={e.vinegarAcidityPct}
        hint="From the label; tested recipes use 5% (USDA Guide 6)"
      />
      <TextField label="Water" suffix="mL" inputMode="decimal" autoComplete="off" value={v.waterMl} onChange={set('waterMl')} error={e.waterMl} />
      <TextField
        label="Other liquid (optional)"
        suffix="mL"
        inputMode="decimal"
        autoComplete="off"
        value={v.otherMl}
        onChange={set('otherMl')}
        error={e.otherMl}
        hint="Juice, wine: counted as volume, not as acid"
      />
      <TextField
        label="Produce in the jars (optional)"
        suffix="g"
        inputMode="decimal"
        autoComplete="off"
        value={v.produceG}
        onChange={set('produceG')}
        error={e.produceG}
        hint="1 lb = 453.6 g"
      />
      <TextField
        label="Water in the produce (optional)"
        suffix="%"
        inputMode="decimal"
        autoComplete="off"
        placeholder="95"
        value={v.produceWaterPct}
        onChange={set('produceWaterPct')}
        error={e.produceWaterPct}
        hint={`Cucumbers are about 95% water (${PRODUCE_WATER_SOURCE})`}
      />
    </CalculatorShell>
  );
}
