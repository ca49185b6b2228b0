import type { Metadata } from 'next';
import {
  BatchPlanner,
  BoilingPointCalculator,
  BrineCalculator,
  CrispingCalculator,
  HeadspaceCalculator,
  PressureCalculator,
  ProcessingTimeCalculator,
  SaltCalculator,
  SugarCalculator,
  UnitConverter,
} from '@/components/calculators';

export const metadata: Metadata = {
  title: 'Brine bench',
  description:
    'Every Brinewright calculator on one page: brine acidity, salt, headspace, processing time and pressure by altitude, boiling point, crisping agents, batches and units.',
};

// Public and the same for everyone: rendered once at build time.
export const dynamic = 'force-static';

const TOOLS = [
  { id: 'brine', label: 'Brine acidity', Calculator: BrineCalculator },
  { id: 'salt', label: 'Salt by weight', Calculator: SaltCalculator },
  { id: 'sugar', label: 'Sugar by weight', Calculator: SugarCalculator },
  { id: 'headspace', label: 'Headspace', Calculator: HeadspaceCalculator },
  { id: 'processing-time', label: 'Processing time', Calculator: ProcessingTimeCalculator },
  { id: 'pressure', label: 'Pressure canner', Calculator: PressureCalculator },
  { id: 'boiling-point', label: 'Boiling point', Calculator: BoilingPointCalculator },
  { id: 'crisping', label: 'Crisping agents', Calculator: CrispingCalculator },
  { id: 'batch', label: 'Batch planner', Calculator: BatchPlanner },
  { id: 'units', label: 'Unit converter', Calculator: UnitConverter },
] as const;

export default function BenchPage() {
  return (
    <div className="space-y-8">
      <header className="space-y-3">
        <h1 className="text-3xl font-bold md:text-4xl">Brine bench</h1>
        <p className="max-w-prose text-lg text-ink-soft">
          The calculators of the course, all in one place. Each one answers as you type, shows US and metric units, and links to the lesson that explains the
          idea behind it.
        </p>
        <aside role="note" aria-label="Safety" className="max-w-prose rounded-jar border-l-4 border-beet-600 bg-beet-50 px-5 py-4">
          <p className="font-display font-bold text-beet-700">These tools check arithmetic. They never call a recipe safe.</p>
          <p className="mt-1 text-ink">
            Botulism cannot be seen, smelled or tasted. Put up food only from tested recipes of recognised food-safety authorities, keep their proportions of
            vinegar, water and salt, process for the full time at your altitude, and follow your local extension office, local codes and licensed practice where
            they apply. Boiling water, steam, hot glass and lime can hurt: work with care.
          </p>
        </aside>
        <nav aria-label="Calculators on this page">
          <ul className="flex flex-wrap gap-2 text-sm">
            {TOOLS.map((tool) => (
              <li key={tool.id}>
                <a
                  href={`#${tool.id}`}
                  className="inline-block rounded-full border border-brine-200 bg-white px-3 py-1 font-medium text-brine-800 no-underline hover:bg-brine-50"
                >
                  {tool.label}
                </a>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <div className="grid gap-2 lg:grid-cols-2 lg:gap-x-6">
        {TOOLS.map(({ id, Calculator }) => (
          <div key={id} id={id} className="scroll-mt-4">
            <Calculator headingLevel={2} />
          </div>
        ))}
      </div>
    </div>
  );
}
