'use client';

import { useState } from 'react';
import { boilingPoint } from '@/lib/preserving/boiling';
import { ALTITUDE_FIELDS, AltitudeField, readAltitudeFt } from './altitude-field';
import type { AltitudeUnit } from '@/lib/preserving/units';
import { CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';

/** The boiling point of water at an altitude, and why that changes the processing time. */
export function BoilingPointCalculator({ headingLevel }: { headingLevel?: 2 | 3 }) {
  const [altitude, setAltitude] = useState('5000');
  const [unit, setUnit] = useState<AltitudeUnit>('ft');
  const outcome = calculate((read) => boilingPoint({ altitudeFt: readAltitudeFt(read, altitude, unit) }), ALTITUDE_FIELDS);
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Boiling point of water"
      intro="Air pressure falls with altitude, so water boils at a lower temperature and kills spoilage organisms more slowly."
      headingLevel={headingLevel}
      lesson={LESSONS.processing}
      caution="Boiling water and steam scald: lift jars straight up with a jar lifter and keep children away from the canner."
      result={
        r ? (
          <div className="space-y-2">
            <p className="text-sm" data-testid="boiling-meaning">
              {212 - r.fahrenheit >= 0.5
                ? `At this height water boils ${fmt(212 - r.fahrenheit, 1)} °F cooler than at sea level, so it kills spoilage organisms more slowly: tested recipes add processing minutes for your altitude.`
                : 'At this height water boils at about its sea-level temperature (212 °F): use the tested recipe’s time for your altitude.'}
            </p>
            <p className="text-xl font-bold" data-testid="boiling-point">
              {fmt(r.fahrenheit, 1)} °F ({fmt(r.celsius, 1)} °C)
            </p>
            <details className="text-sm">
              <summary className="cursor-pointer font-semibold text-brine-800">How this is worked out</summary>
              <p className="mt-1">
                Air pressure at this height is {fmt(r.pressurePa / 1000, 1)} kPa in the standard atmosphere (the weather moves it a little); water boils where
                its vapour pressure reaches the air&apos;s.
              </p>
              <p className="text-xs text-ink-soft">Model: {r.source}</p>
            </details>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
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
