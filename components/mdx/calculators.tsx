'use client';

import dynamic from 'next/dynamic';
import type { ComponentProps, ComponentType } from 'react';

// The calculators a lesson embeds, each loaded on demand from its own file: the server renders
// the ones a lesson uses into its HTML, and the browser downloads only those chunks, so a lesson
// does not ship the code of the other eight.

function CalculatorLoading() {
  return <div aria-hidden="true" className="my-6 h-64 animate-pulse rounded-jar border border-brine-100 bg-paper-deep" />;
}

function slot<P extends object>(Calculator: ComponentType<P>, name: string) {
  function CalculatorSlot(props: P) {
    return (
      <div data-calculator-slot className="my-8">
        <Calculator {...props} />
        <p data-print-note className="hidden">
          {name}: an interactive calculator. Use it in this lesson online, or on the Brine bench at /bench.
        </p>
      </div>
    );
  }
  CalculatorSlot.displayName = `Slot(${name})`;
  return CalculatorSlot;
}

const Brine = dynamic(() => import('@/components/calculators/brine-calculator').then((m) => m.BrineCalculator), { loading: CalculatorLoading });
const Salt = dynamic(() => import('@/components/calculators/salt-calculator').then((m) => m.SaltCalculator), { loading: CalculatorLoading });
const Sugar = dynamic(() => import('@/components/calculators/sugar-calculator').then((m) => m.SugarCalculator), { loading: CalculatorLoading });
const Headspace = dynamic(() => import('@/components/calculators/headspace-calculator').then((m) => m.HeadspaceCalculator), { loading: CalculatorLoading });
const ProcessingTime = dynamic(() => import('@/components/calculators/processing-time-calculator').then((m) => m.ProcessingTimeCalculator), {
  loading: CalculatorLoading,
});
const Pressure = dynamic(() => import('@/components/calculators/pressure-calculator').then((m) => m.PressureCalculator), { loading: CalculatorLoading });
const BoilingPoint = dynamic(() => import('@/components/calculators/boiling-point-calculator').then((m) => m.BoilingPointCalculator), {
  loading: CalculatorLoading,
});
const Crisping = dynamic(() => import('@/components/calculators/crisping-calculator').then((m) => m.CrispingCalculator), { loading: CalculatorLoading });
const Batch = dynamic(() => import('@/components/calculators/batch-planner').then((m) => m.BatchPlanner), { loading: CalculatorLoading });
const Units = dynamic(() => import('@/components/calculators/unit-converter').then((m) => m.UnitConverter), { loading: CalculatorLoading });

type Props<T extends keyof typeof import('@/components/calculators')> = ComponentProps<(typeof import('@/components/calculators'))[T]>;

export const BrineCalculator = slot<Props<'BrineCalculator'>>(Brine, 'Brine acidity calculator');
export const SaltCalculator = slot<Props<'SaltCalculator'>>(Salt, 'Salt calculator');
export const SugarCalculator = slot<Props<'SugarCalculator'>>(Sugar, 'Sugar calculator');
export const HeadspaceCalculator = slot<Props<'HeadspaceCalculator'>>(Headspace, 'Headspace checker');
export const ProcessingTimeCalculator = slot<Props<'ProcessingTimeCalculator'>>(ProcessingTime, 'Processing time calculator');
export const PressureCalculator = slot<Props<'PressureCalculator'>>(Pressure, 'Pressure canner calculator');
export const BoilingPointCalculator = slot<Props<'BoilingPointCalculator'>>(BoilingPoint, 'Boiling point calculator');
export const CrispingCalculator = slot<Props<'CrispingCalculator'>>(Crisping, 'Crisping agent calculator');
export const BatchPlanner = slot<Props<'BatchPlanner'>>(Batch, 'Batch planner');
export const UnitConverter = slot<Props<'UnitConverter'>>(Units, 'Unit converter');
