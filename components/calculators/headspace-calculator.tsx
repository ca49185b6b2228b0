'use client';

import { useState } from 'react';
import { TextField } from '@/components/ui/text-field';
import { RULES } from '@/lib/preserving/errors';
import { headspaceCheck } from '@/lib/preserving/headspace';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt, kitchen } from './parts';
import { ProductSelect, startProduct } from './product-fields';

const VERDICT = { 'too-little': 'Too little headspace', ok: 'Headspace is right', 'too-much': 'Too much headspace' } as const;

/** The tested recipe's headspace and a verdict on a measured one. */
export function HeadspaceCalculator({ defaultProduct, headingLevel }: { defaultProduct?: string; headingLevel?: 2 | 3 }) {
  const [product, setProduct] = useState(startProduct(defaultProduct));
  const [measured, setMeasured] = useState('');
  const outcome = calculate((read) => headspaceCheck({ product, measuredIn: read.opt(measured, RULES.measuredIn) }), ['product', 'measuredIn']);
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Headspace check"
      intro="The space between the food and the jar's rim, as the tested recipe gives it, and whether your jar has it."
      headingLevel={headingLevel}
      lesson={LESSONS.headspace}
      caution="Measure from the top of the liquid to the top of the rim, after removing air bubbles. Wipe the rim before the lid goes on."
      result={
        r ? (
          <div className="space-y-1">
            <p className="text-xl font-bold" data-testid="headspace-recommended">
              Leave {kitchen(r.recommendedIn)} inch ({fmt(r.recommendedIn * 25.4, 1)} mm)
            </p>
            {r.verdict ? (
              <>
                <p>
                  <strong className={r.verdict === 'ok' ? 'text-brine-800' : 'text-beet-700'}>{VERDICT[r.verdict]}.</strong> {r.why}
                </p>
                <p className="text-xs text-ink-soft">
                  Verdict tolerance: ±{kitchen(r.toleranceIn ?? 0)} inch, {r.toleranceSource}.
                </p>
              </>
            ) : (
              <p className="text-sm text-ink-soft">Enter a measured headspace for a verdict.</p>
            )}
            <p className="text-xs text-ink-soft">Source: {r.source}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <ProductSelect value={product} onChange={setProduct} />
      <TextField
        label="Measured headspace (optional)"
        suffix="inches"
        inputMode="decimal"
        autoComplete="off"
        value={measured}
        onChange={(event) => setMeasured(event.target.value)}
        error={outcome.fieldErrors.measuredIn}
        hint="Such as 1/2 or 0.5; 1 inch = 25.4 mm"
      />
    </CalculatorShell>
  );
}
