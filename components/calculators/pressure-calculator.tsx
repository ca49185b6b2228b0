'use client';

import { useState } from 'react';
import { Select } from '@/components/ui/select';
import { cannerTemperature } from '@/lib/preserving/boiling';
import { GAUGES, pressureForAltitude } from '@/lib/preserving/pressure';
import { ALTITUDE_FIELDS, AltitudeField, readAltitudeFt } from './altitude-field';
import type { AltitudeUnit } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

const GAUGE_OPTIONS = GAUGES.map((g) => ({ value: g, label: g === 'weighted' ? 'Weighted gauge' : 'Dial gauge' }));

/** Pressure-canner pounds by gauge type and altitude (for low-acid foods in a tested pressure recipe). */
export function PressureCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [gauge, setGauge] = useState('dial');
  const [altitude, setAltitude] = useState('0');
  const [unit, setUnit] = useState<AltitudeUnit>('ft');
  const outcome = calculate(
    (read) => {
      const altitudeFt = readAltitudeFt(read, altitude, unit);
      const result = pressureForAltitude({ gauge, altitudeFt });
      return { ...result, steam: cannerTemperature({ psig: result.pounds, altitudeFt }) };
    },
    ['gauge', ...ALTITUDE_FIELDS],
  );
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Pressure canner by altitude"
      intro="Low-acid foods need a pressure canner. The pressure rises with altitude; the tested recipe's minutes stay the same."
      headingLevel={headingLevel}
      lesson={LESSONS.processing}
      caution="Have a dial gauge tested for accuracy every year. Before you close the vent, let steam pour from it for a full 10 minutes; when the time is up, turn off the heat and let the gauge fall to zero by itself before you open the canner (USDA Complete Guide to Home Canning, Guide 1, 'Using pressure canners'; Pacific Northwest Extension PNW 421)."
      result={
        r ? (
          <div className="space-y-1">
            <p className="text-xl font-bold" data-testid="pressure-pounds">
              {r.pounds} pounds (psi) on a {r.gauge} gauge
            </p>
            <p className="text-sm">
              Steam inside at that pressure: about {fmt(r.steam.fahrenheit, 1)} °F ({fmt(r.steam.celsius, 1)} °C).
            </p>
            {r.confidence !== 'verified' ? (
              <p className="text-sm font-medium text-honey-700">
                The USDA tables stop at 8,000 ft for dial gauges: check your tested recipe and your local extension office.
              </p>
            ) : null}
            <details className="text-xs text-ink-soft">
              <summary className="cursor-pointer text-sm font-semibold text-brine-800">How this is worked out</summary>
              <p className="mt-1">
                {r.pounds} psi is {fmt(r.pounds * 6.894757, 0)} kPa above the air around the canner; the steam temperature adds that to the air pressure at your
                altitude (standard atmosphere) and reads the boiling point of water there. Source: {r.source}
              </p>
            </details>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <Select label="Gauge type" options={GAUGE_OPTIONS} value={gauge} onChange={(event) => setGauge(event.target.value)} error={outcome.fieldErrors.gauge} />
      <AltitudeField
        value={altitude}
        onChange={setAltitude}
        unit={unit}
        onUnitChange={setUnit}
        error={outcome.fieldErrors.altitudeFt ?? outcome.fieldErrors.altitudeM}
      />
    </CalculatorShell>
  );
}
