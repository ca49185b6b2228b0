'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { CRISPING_AGENTS, crispingPlan } from '@/lib/preserving/crisping';
import { RULES } from '@/lib/preserving/errors';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt, kitchen } from './parts';
import { JarSelect, JarsField } from './product-fields';

const AGENT_OPTIONS = CRISPING_AGENTS.map((a) => ({ value: a, label: a === 'calcium-chloride' ? 'Calcium chloride granules' : 'Pickling lime (food-grade)' }));

/** Calcium chloride per jar and per batch, or the pickling-lime soak and rinse schedule. */
export function CrispingCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [agent, setAgent] = useState('calcium-chloride');
  const [jar, setJar] = useState('pint');
  const [jars, setJars] = useState('7');
  const outcome = calculate((read) => crispingPlan({ agent, jar, jars: read.num(jars, RULES.jars) }), ['agent', 'jar', 'jars']);
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Crisping agents"
      intro="Dose per jar for calcium chloride, or the lime-water soak and rinses of the one tested recipe that uses pickling lime."
      headingLevel={headingLevel}
      lesson={LESSONS.crisp}
      caution="Lime is caustic: wear gloves, avoid the dust, and rinse exactly as the recipe says. Alum is not needed and does not firm quick pickles (USDA Complete Guide to Home Canning, Guide 6)."
      result={
        r ? (
          <div className="space-y-2">
            {r.agent === 'calcium-chloride' ? (
              <p className="text-xl font-bold" data-testid="crisping-dose">
                {kitchen(r.perJarTsp)} tsp per jar, {kitchen(r.totalTsp)} tsp in all ({fmt(r.totalTsp * 4.92892159375, 1)} mL)
              </p>
            ) : (
              <>
                <p className="text-sm font-medium" data-testid="crisping-recipe">
                  For {r.recipeName.toLowerCase()} only: {r.recipes} recipe{r.recipes === 1 ? '' : 's'} of lime water (one for each 6 lb of cucumbers, about 8
                  pints)
                </p>
                <p className="text-xl font-bold" data-testid="crisping-dose">
                  {kitchen(r.limeCups)} cup{r.limeCups > 1 ? 's' : ''} of pickling lime and {kitchen(r.saltCups)} cup{r.saltCups > 1 ? 's' : ''} of pickling
                  salt in {kitchen(r.waterGallons)} gallon
                  {r.waterGallons > 1 ? 's' : ''} of water ({fmt(r.waterGallons * 3.785411784, 1)} L); soak {r.soakHours[0]} to {r.soakHours[1]} hours, then
                  rinse and soak 1 hour in fresh water {r.rinses} times
                </p>
              </>
            )}
            <ul className="list-disc space-y-1 pl-5 text-sm">
              {r.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
            <p className="text-xs text-ink-soft">Source: {r.source}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <Select
        label="Crisping agent"
        options={AGENT_OPTIONS}
        value={agent}
        onChange={(event) => setAgent(event.target.value)}
        error={outcome.fieldErrors.agent}
      />
      <JarSelect value={jar} onChange={setJar} error={outcome.fieldErrors.jar} />
      <JarsField value={jars} onChange={setJars} error={outcome.fieldErrors.jars} />
    </CalculatorShell>
  );
}
