import { useState } from 'react';
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { PlanLine } from '@millrace/contracts';
import { formatNumber } from '@/lib/format';
import { ChartFrame, ChartTable } from './chart-frame';
import { ChartPicker } from './chart-picker';

/** Stock and backorder (late) over the weeks for the product picked. */
export function StockChart({ lines }: { lines: PlanLine[] }) {
  const products = [...new Map(lines.map((l) => [l.product, l.productName])).entries()].sort((a, b) => a[0].localeCompare(b[0]));
  const firstWithLate = lines.find((l) => l.late > 1e-9)?.product;
  const [picked, setPicked] = useState(firstWithLate ?? products[0]?.[0] ?? '');
  const rows = lines
    .filter((l) => l.product === picked)
    .sort((a, b) => a.week - b.week)
    .map((l) => ({ week: `W${l.week}`, stock: l.stock, late: l.late, make: l.make, demand: l.demand }));
  const name = products.find(([c]) => c === picked)?.[1] ?? picked;
  return (
    <ChartFrame
      title={`Stock and backorder: ${name}`}
      note="Solid line: stock at the end of each week; dashed line: quantity carried late (backorder)."
      controls={<ChartPicker label="Product" items={products} value={picked} onChange={setPicked} />}
      table={
        <ChartTable
          caption={`Stock and backorder of ${name} per week`}
          head={['Week', 'Demand', 'Make', 'Stock', 'Late']}
          rows={rows.map((r) => [r.week, formatNumber(r.demand), formatNumber(r.make), formatNumber(r.stock), formatNumber(r.late)])}
        />
      }
    >
      <ResponsiveContainer width="100%" height={260}>
        <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 0, left: 0 }}>
          <CartesianGrid stroke="#d9d6cc" strokeDasharray="3 3" />
          <XAxis dataKey="week" />
          <YAxis width={64} />
          <Tooltip formatter={(v) => formatNumber(Number(v))} />
          <Legend />
          <Line dataKey="stock" name="Stock" stroke="#2d6e6a" strokeWidth={2} isAnimationActive={false} />
          <Line dataKey="late" name="Backorder (late)" stroke="#9b2f24" strokeWidth={2} strokeDasharray="6 3" isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}
