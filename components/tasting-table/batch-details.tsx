import { TBody, TD, TH, THead, TR } from '@/components/ui/table';
import type { Expectations } from '@/lib/practicals/checks';
import { PRODUCTS } from '@/lib/preserving/products';
import { PROCESSING_METHOD_LABELS, type PracticalDetails } from '@/lib/validations/practical';

// Details are stored JSON: rows written by older code or seeders may lack fields, so each value is optional.
const n = (v: unknown, digits = 2) => (typeof v === 'number' && Number.isFinite(v) ? String(Number(v.toFixed(digits))) : '—');
const t = (v: unknown) => (typeof v === 'string' && v ? v : '—');
/** A value put together from parts: one dash when none of its parts was given, not one per part. */
const joined = (parts: string[], text: string) => (parts.every((p) => p === '—') ? '—' : text);

/** The learner's batch beside what the published tables give for it. */
export function BatchDetails({ details, expected }: { details: Partial<PracticalDetails>; expected: Expectations }) {
  const processing = expected.processing;
  const rows: { label: string; value: string; expected?: string }[] = [
    { label: 'Product', value: (details.product && PRODUCTS[details.product]?.name) || t(details.product) },
    { label: 'Tested recipe', value: joined([t(details.recipeTitle), t(details.recipeSource)], `${t(details.recipeTitle)}, ${t(details.recipeSource)}`) },
    { label: 'Pack', value: details.pack ? `${details.pack} pack` : '—', expected: expected.pack ? `${expected.pack} pack` : undefined },
    { label: 'Jars', value: joined([n(details.jars, 0), t(details.jar)], `${n(details.jars, 0)} × ${t(details.jar)}`) },
    {
      label: 'Vinegar',
      value: joined([n(details.vinegarMl, 0), n(details.vinegarAcidityPct)], `${n(details.vinegarMl, 0)} mL at ${n(details.vinegarAcidityPct)} % acidity`),
      expected: 'at least 5 % acidity',
    },
    {
      label: 'Water',
      value: joined([n(details.waterMl, 0)], `${n(details.waterMl, 0)} mL`),
      expected: expected.brine
        ? `tested liquid ${n(expected.brine.testedAceticAcidPct)} % acetic acid or more (this brine ${n(expected.brine.aceticAcidPct)} %)`
        : expected.brineStrength
          ? `fermented brine ${n(expected.brineStrength.minPct)}–${n(expected.brineStrength.maxPct)} % salt by weight${expected.brineStrength.saltPct !== undefined ? ` (this brine ${n(expected.brineStrength.saltPct)} %)` : ''}`
          : undefined,
    },
    {
      label: 'Headspace measured',
      value: joined([n(details.headspaceIn, 3)], `${n(details.headspaceIn, 3)} in`),
      expected: expected.headspace ? `${n(expected.headspace.recommendedIn, 3)} in` : undefined,
    },
    { label: 'Method', value: (details.method && PROCESSING_METHOD_LABELS[details.method]) || t(details.method) },
    { label: 'Altitude', value: typeof details.altitudeFt === 'number' ? `${details.altitudeFt.toLocaleString('en-US')} ft` : '—' },
    {
      label: 'Minutes processed',
      value: joined([n(details.minutes, 0)], `${n(details.minutes, 0)} min`),
      expected: !processing
        ? undefined
        : 'unavailable' in processing
          ? processing.unavailable
          : details.method === 'low-temperature-pasteurization' && expected.lowTemperaturePasteurization
            ? `${expected.lowTemperaturePasteurization.minutes} min at ${expected.lowTemperaturePasteurization.waterTempF.join('–')} °F (or ${processing.minutes} min in boiling water)`
            : `${processing.minutes} min in boiling water for ${processing.altitudeBand.toFt === null ? `above ${processing.altitudeBand.fromFt.toLocaleString('en-US')}` : `${processing.altitudeBand.fromFt.toLocaleString('en-US')}–${processing.altitudeBand.toFt.toLocaleString('en-US')}`} ft`,
    },
    { label: 'Date put up', value: t(details.batchDate) },
    {
      label: 'Seals',
      value: joined([n(details.sealedJars, 0), n(details.unsealedJars, 0)], `${n(details.sealedJars, 0)} sealed, ${n(details.unsealedJars, 0)} not sealed`),
      expected: 'every jar sealed',
    },
    { label: 'Notes', value: details.notes || '—' },
  ];
  return (
    // Fixed layout with wrapping cells: the table fits its column and never needs a scrollbar.
    <div className="rounded-jar border border-brine-100 bg-white shadow-shelf">
      <table className="w-full table-fixed border-collapse text-left text-sm [overflow-wrap:anywhere]">
        <caption className="px-4 pt-3 pb-1 text-left font-display text-base text-brine-900">The batch and the published numbers</caption>
        <THead>
          <tr>
            <TH className="w-1/4 whitespace-normal">Item</TH>
            <TH className="whitespace-normal">Learner entered</TH>
            <TH className="whitespace-normal">Published for this batch</TH>
          </tr>
        </THead>
        <TBody>
          {rows.map((row) => (
            <TR key={row.label}>
              <TH scope="row" className="align-top font-semibold whitespace-normal">
                {row.label}
              </TH>
              <TD className="whitespace-pre-wrap">{row.value}</TD>
              <TD className="text-ink-soft">{row.expected ?? '—'}</TD>
            </TR>
          ))}
        </TBody>
        {processing && !('unavailable' in processing) ? (
          <tfoot>
            <tr>
              <td colSpan={3} className="px-4 py-2 text-xs text-ink-soft">
                Source: {processing.source}
              </td>
            </tr>
          </tfoot>
        ) : null}
      </table>
    </div>
  );
}
