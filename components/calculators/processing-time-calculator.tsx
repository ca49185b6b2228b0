'use client';

import { useState } from 'react';
import { processingTime } from '@/lib/preserving/processing';
import { ALTITUDE_FIELDS, AltitudeField, readAltitudeFt } from './altitude-field';
import type { AltitudeUnit } from '@/lib/preserving/units';
import { ARITHMETIC_ONLY, CalculatorShell, LESSONS, ResultMessage, calculate, fmt } from './parts';
import { JarSelect, ProductSelect, startProduct } from './product-fields';

const band = (fromFt: number, toFt: number | null) =>
  fromFt === 6001
    ? `above 6,000 ft (table used up to ${fmt(toFt ?? 10000, 0)} ft)`
    : fromFt === 0
      ? `up to ${fmt(toFt ?? 0, 0)} ft (below sea level too)`
      : `${fmt(fromFt, 0)} to ${fmt(toFt ?? 0, 0)} ft`;

/** Boiling-water processing minutes for a product, jar size and altitude, from its published table. */
export function ProcessingTimeCalculator({ defaultProduct, headingLevel }: { defaultProduct?: string; headingLevel?: 2 | 3 }) {
  const [product, setProduct] = useState(startProduct(defaultProduct));
  const [jar, setJar] = useState('pint');
  const [altitude, setAltitude] = useState('0');
  const [unit, setUnit] = useState<AltitudeUnit>('ft');
  const outcome = calculate(
    (read) => processingTime({ product, jar, altitudeFt: readAltitudeFt(read, altitude, unit) }),
    ['product', 'jar', ...ALTITUDE_FIELDS],
  );
  const r = outcome.result;
  return (
    <CalculatorShell
      title="Processing time by altitude"
      intro="Minutes in a boiling-water canner from the product's published table. Water boils cooler as you go up, so the time rises."
      headingLevel={headingLevel}
      lesson={LESSONS.processing}
      caution={`Start timing when the water over the jars returns to a full rolling boil, with at least 1 inch of water above the lids (USDA Complete Guide to Home Canning, Guide 1). ${ARITHMETIC_ONLY}`}
      result={
        r ? (
          <div className="space-y-1">
            <p className="text-xl font-bold" data-testid="processing-minutes">
              {r.minutes} minutes in a boiling-water canner
            </p>
            <p className="text-sm">Altitude band: {band(r.altitudeBand.fromFt, r.altitudeBand.toFt)}</p>
            {r.sterilizeJars ? (
              <p className="text-sm font-medium text-beet-700" data-testid="processing-sterilize">
                {r.sterilizeJars.message} <span className="block text-xs font-normal text-ink-soft">Source: {r.sterilizeJars.source}</span>
              </p>
            ) : null}
            {r.lowTemperaturePasteurization ? (
              <p className="text-sm">
                The guide also allows low-temperature pasteurization for this product: {r.lowTemperaturePasteurization.waterTempF[0]} to{' '}
                {r.lowTemperaturePasteurization.waterTempF[1]} °F (82 to 85 °C) water for {r.lowTemperaturePasteurization.minutes} minutes, checked with a
                thermometer the whole time (USDA Complete Guide to Home Canning, Guide 6).
              </p>
            ) : null}
            <p className="text-xs text-ink-soft">Source: {r.source}</p>
          </div>
        ) : (
          <ResultMessage outcome={outcome} />
        )
      }
    >
      <ProductSelect value={product} onChange={setProduct} error={outcome.fieldErrors.product} />
      <JarSelect value={jar} onChange={setJar} error={outcome.fieldErrors.jar} />
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
