'use client';

import { useState } from 'react';
import { TextField } from '@/components/ui/text-field';
import { brineAcidity } from '@/lib/preserving/acidity';
import { RULES } from '@/lib/preserving/errors';
import { convert } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const FIELDS = ['vinegarMl', 'vinegarAcidityPct', 'waterMl', 'otherMl', 'produceG', 'produceWaterPct'] as const;

/** Acetic acid, vinegar share and estimated pH of a brine, and the acidity once produce water mixes in. */
export function BrineCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [v, setV] = useState({ vinegarMl: '750', vinegarAcidityPct: '5', waterMl: '750', otherMl: '', produceG: '', produceWaterPct: '' });
  const set = (key: keyof typeof v) => (event: React.ChangeEvent<HTMLInputElement>) => setV({ ...v, [key]: event.target.value });
  const outcome = calculate(
    (read) =>
      brineAcidity({
        vinegarMl: read.num(v.vinegarMl, RULES.vinegarMl),
        vinegarAcidityPct: read.num(v.vinegarAcidityPct, RULES.vinegarAcidityPct),
        waterMl: read.num(v.waterMl, RULES.waterMl),
        otherMl: read.opt(v.otherMl, RULES.otherMl),
        produceG: read.opt(v.produceG, RULES.produceG),
        produceWaterPct: read.opt(v.produceWaterPct, RULES.produceWaterPct),
      }),
    FIELDS,
  );
  const e = outcome.fieldErrors;
  const r = outcome.result;
  const totalMl = (Number(v.vinegarMl) || 0) + (Number(v.waterMl) || 0) + (Number(v.otherMl) || 0);
  return (
    <CalculatorShell
      title="Brine acidity"
      intro="How much acetic acid a vinegar and water mix holds, and its estimated pH from the weak-acid equation."
      headingLevel={headingLevel}
      lesson={LESSONS.acidity}
      caution="Never dilute the vinegar of a tested recipe. An estimate is not a pH reading: produce buffers acid, so the jar settles higher."
      result={
        r ? (
          <div className="space-y-2">
            <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-2">
              <div>
                <dt className="text-sm text-ink-soft">Acetic acid in the liquid</dt>
                <dd className="text-xl font-bold" data-testid="brine-acid">{fmt(r.aceticAcidPct, 2)} g per 100 mL</dd>
              </div>
              <div>
                <dt className="text-sm text-ink-soft">Estimated pH of the liquid</dt>
                <dd className="text-xl font-bold" data-testid="brine-ph">{fmt(r.estimatedPh, 2)}</dd>
              </div>
              <div>
                <dt className="text-sm text-ink-soft">Share of vinegar</dt>
                <dd>
                  {fmt(r.vinegarShare * 100, 1)}% of {fmt(totalMl, 0)} mL ({fmt(convert(totalMl, 'mL', 'cup'), 2)} US cups)
                </dd>
              </div>
              {r.equilibratedAcidityPct !== undefined ? (
                <div>
                  <dt className="text-sm text-ink-soft">With the produce water mixed in</dt>
                  <dd>
                    {fmt(r.equilibratedAcidityPct, 2)} g per 100 mL, pH about {fmt(r.equilibratedPh ?? 0, 2)} before buffering
                  </dd>
                </div>
              ) : null}
            </dl>
            {r.warnings.length ? (
              <ul className="list-disc space-y-1 pl-5 text-sm font-medium text-beet-700">
                {r.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <TextField label="Vinegar" suffix="mL" inputMode="decimal" autoComplete="off" value={v.vinegarMl} onChange={set('vinegarMl')} error={e.vinegarMl} hint="1 US cup = 236.6 mL" />
      <TextField label="Vinegar acidity" suffix="%" inputMode="decimal" autoComplete="off" value={v.vinegarAcidityPct} onChange={set('vinegarAcidityPct')} error={e.vinegarAcidityPct} hint="From the label; pickling needs 5%" />
      <TextField label="Water" suffix="mL" inputMode="decimal" autoComplete="off" value={v.waterMl} onChange={set('waterMl')} error={e.waterMl} />
      <TextField label="Other liquid (optional)" suffix="mL" inputMode="decimal" autoComplete="off" value={v.otherMl} onChange={set('otherMl')} error={e.otherMl} hint="Juice, wine: counted as volume, not as acid" />
      <TextField label="Produce in the jars (optional)" suffix="g" inputMode="decimal" autoComplete="off" value={v.produceG} onChange={set('produceG')} error={e.produceG} hint="1 lb = 453.6 g" />
      <TextField label="Water in the produce (optional)" suffix="%" inputMode="decimal" autoComplete="off" placeholder="95" value={v.produceWaterPct} onChange={set('produceWaterPct')} error={e.produceWaterPct} hint="Cucumbers are about 95% water" />
    </CalculatorShell>
  );
}
