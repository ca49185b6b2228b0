'use client';

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

type Datum = Record<string, string | number>;
type Series = { key: string; name: string; color: string };

/**
 * A bar chart for the desk's reports. The chart is a picture of the table printed beside it,
 * so it is hidden from assistive technology (aria-hidden) and the table carries the numbers.
 */
export function ReportBarChart({ data, x, series, unit }: { data: Datum[]; x: string; series: Series[]; unit?: string }) {
  return (
    <div aria-hidden="true" className="h-64 w-full">
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 12, bottom: 8, left: 0 }} accessibilityLayer={false}>
          <CartesianGrid strokeDasharray="3 3" stroke="#d9e4e1" />
          <XAxis dataKey={x} tick={{ fontSize: 12 }} />
          <YAxis allowDecimals={false} tick={{ fontSize: 12 }} unit={unit} />
          <Tooltip />
          {series.length > 1 ? <Legend /> : null}
          {series.map((s) => (
            <Bar key={s.key} dataKey={s.key} name={s.name} fill={s.color} radius={[4, 4, 0, 0]} isAnimationActive={false} />
          ))}
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
