'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { cannerTemperature } from '@/lib/preserving/boiling';
import { RULES } from '@/lib/preserving/errors';
import { GAUGES, pressureForAltitude } from '@/lib/preserving/pressure';
import { AltitudeField } from './altitude-field';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const GAUGE_OPTIONS = GAUGES.map((g) => ({ value: g, label: g === 'weighted' ? 'Weighted gauge' : 'Dial gauge' }));

/** Pressure-canner pounds by gauge type and altitude (for low-acid foods in a tested pressure recipe). */
export function PressureCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [gauge, setGauge] = useState('dial');
  const [altitude, setAltitude] = useState('0');
  const outcome = calculate((read) => {
    const altitudeFt = read.num(altitude, RULES.altitudeFt);
    const result = pressureForAltitude({ gauge, altitudeFt });
    return { ...result, steam: cannerTemperature({ psig: result.pounds, altitudeFt }) };
  }, ['gauge', 'altitudeFt']);
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Pressure canner by altitude"
      intro="Low-acid foods need a pressure canner. The pressure rises with altitude; the tested recipe's minutes stay the same."
      headingLevel={headingLevel}
      lesson={LESSONS.processing}
      caution="Have a dial gauge tested for accuracy every year, vent the canner 10 minutes before pressurizing, and let it depressurize on its own."
      result={
        r ? (
          <div className="space-y-1">
            <p className="text-xl font-bold" data-testid="pressure-pounds">
              {r.pounds} psi ({fmt(r.pounds * 6.894757, 0)} kPa) on a {r.gauge} gauge
            </p>
            <p className="text-sm">
              Steam inside at that pressure: about {fmt(r.steam.fahrenheit, 1)} °F ({fmt(r.steam.celsius, 1)} °C).
            </p>
            {r.confidence !== 'verified' ? <p className="text-sm font-medium text-honey-700">The USDA tables stop at 8,000 ft for dial gauges: check your tested recipe and your local extension office.</p> : null}
            <p className="text-xs text-ink-soft">Source: {r.source}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <Select label="Gauge type" options={GAUGE_OPTIONS} value={gauge} onChange={(event) => setGauge(event.target.value)} error={outcome.fieldErrors.gauge} />
      <AltitudeField value={altitude} onChange={setAltitude} error={outcome.fieldErrors.altitudeFt} />
    </CalculatorShell>
  );
}
