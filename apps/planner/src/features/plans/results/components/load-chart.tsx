import { useState } from 'react';
import { Bar, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { LoadRow } from '@millrace/contracts';
import { formatNumber } from '@/lib/format';
import { ChartFrame, ChartTable } from './chart-frame';
import { ChartPicker } from './chart-picker';

/** Load (regular and overtime hours, stacked) against available hours, week by week, for one work center. */
export function LoadChart({ load }: { load: LoadRow[] }) {
  const centers = [...new Map(load.map((r) => [r.workCenter, r.workCenterName])).entries()].sort((a, b) => a[0].localeCompare(b[0]));
  const [picked, setPicked] = useState(centers[0]?.[0] ?? '');
  const rows = load
    .filter((r) => r.workCenter === picked)
    .sort((a, b) => a.week - b.week)
    .map((r) => ({
      week: `W${r.week}`,
      regular: Math.max(0, r.loadHours - r.overtimeHours),
      overtime: r.overtimeHours,
      available: r.availableHours,
    }));
  const name = centers.find(([c]) => c === picked)?.[1] ?? picked;
  return (
    <ChartFrame
      title={`Load against available hours: ${name}`}
      note="Bars: hours loaded (overtime on top); line: hours the calendar makes available."
      controls={<ChartPicker label="Work center" items={centers} value={picked} onChange={setPicked} />}
      table={
        <ChartTable
          caption={`Load of ${name} per week`}
          head={['Week', 'Regular hours', 'Overtime hours', 'Available hours']}
          rows={rows.map((r) => [r.week, formatNumber(r.regular), formatNumber(r.overtime), formatNumber(r.available)])}
        />
      }
    >
      <ResponsiveContainer width="100%" height={280}>
        <ComposedChart data={rows} margin={{ top: 8, right: 16, bottom: 0, left: 0 }}>
          <CartesianGrid stroke="#d9d6cc" strokeDasharray="3 3" />
          <XAxis dataKey="week" />
          <YAxis unit=" h" width={64} />
          <Tooltip formatter={(v) => `${formatNumber(Number(v))} h`} />
          <Legend />
          <Bar dataKey="regular" name="Regular hours" stackId="load" fill="#2d6e6a" isAnimationActive={false} />
          <Bar dataKey="overtime" name="Overtime hours" stackId="load" fill="#c98a45" isAnimationActive={false} />
          <Line dataKey="available" name="Available hours" type="stepAfter" stroke="#22262a" strokeWidth={2} strokeDasharray="6 3" dot={false} isAnimationActive={false} />
        </ComposedChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}
