import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { Bottleneck } from '@millrace/contracts';
import { formatNumber } from '@/lib/format';
import { EmptyState } from '@/components/ui/empty-state';
import { bindingWeeks } from './bottleneck-summary';
import { ChartFrame, ChartTable } from './chart-frame';

/** Bottleneck values of work centers, week by week: the value of one more hour. */
export function BottleneckChart({ bottlenecks, currency }: { bottlenecks: Bottleneck[]; currency: string }) {
  const peak = (b: Bottleneck) => Math.max(...bindingWeeks(b).map((w) => w.value));
  // Strongest first, so it gets the first colour and the first place in the legend.
  const binding = bottlenecks.filter((b) => b.kind === 'capacity' && bindingWeeks(b).length > 0).sort((x, y) => peak(y) - peak(x));
  if (binding.length === 0) {
    return <EmptyState title="No work center is fully used">The value of one more hour is zero everywhere in this plan.</EmptyState>;
  }
  const weeks = [...new Set(binding.flatMap((b) => b.weeks.map((w) => w.week)))].sort((a, b) => a - b);
  const rows = weeks.map((week) => {
    const row: Record<string, number | string> = { week: `W${week}` };
    for (const b of binding) row[b.item] = b.weeks.find((w) => w.week === week)?.value ?? 0;
    return row;
  });
  const palette = ['#235955', '#c98a45', '#545b61', '#9b2f24', '#36632b', '#7a5c9e'];
  const others = bottlenecks.filter((b) => b.kind !== 'capacity' && bindingWeeks(b).length > 0);
  return (
    <div className="flex flex-col gap-2">
    <ChartFrame
      title={`Value of one more hour (${currency} per hour)`}
      note="Bottleneck values: what one more hour of the work center would add to the margin, valid only near the current plan."
      table={
        <ChartTable
          caption="Value of one more hour per work center and week"
          head={['Work center', 'Week', `Value of one more hour (${currency})`]}
          rows={binding.flatMap((b) => bindingWeeks(b).map((w) => [`${b.item} ${b.itemName}`, w.week, formatNumber(w.value)]))}
        />
      }
    >
      <ResponsiveContainer width="100%" height={260}>
        <BarChart data={rows} margin={{ top: 8, right: 16, bottom: 0, left: 0 }}>
          <CartesianGrid stroke="#d9d6cc" strokeDasharray="3 3" />
          <XAxis dataKey="week" />
          <YAxis width={64} />
          <Tooltip formatter={(v) => `${formatNumber(Number(v))} ${currency}`} />
          <Legend />
          {binding.map((b, i) => (
            <Bar key={b.item} dataKey={b.item} name={`${b.item} ${b.itemName}`} fill={palette[i % palette.length]} isAnimationActive={false} />
          ))}
        </BarChart>
      </ResponsiveContainer>
    </ChartFrame>
      {others.length > 0 ? (
        <ul aria-label="Material and supply limits" className="list-disc pl-5 text-sm">
          {others.map((b) => (
            <li key={`${b.kind}-${b.item}`}>{b.message}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
