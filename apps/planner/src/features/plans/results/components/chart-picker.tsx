import { useId } from 'react';

/** The select above a chart that picks the one item (product, work center) it shows; items are [code, name]. */
export function ChartPicker({
  label,
  items,
  value,
  onChange,
}: {
  label: string;
  items: Array<[code: string, name: string]>;
  value: string;
  onChange: (code: string) => void;
}) {
  const pickerId = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={pickerId} className="text-sm font-semibold">
        {label}
      </label>
      <select id={pickerId} value={value} onChange={(e) => onChange(e.target.value)} className="rounded border border-line bg-panel px-2 py-1.5">
        {items.map(([code, n]) => (
          <option key={code} value={code}>
            {code} {n}
          </option>
        ))}
      </select>
    </div>
  );
}
