import { formatSigned } from '../plan-words';

/**
 * A difference b − a with its sign in the text (+ / −) and an arrow, so it reads without colour.
 * `better` says which direction is good for the plant (more margin is good, more overtime is not);
 * `fixed` keeps every decimal place (money: '+283.10').
 */
export function Delta({
  value,
  better = 'neutral',
  digits = 2,
  unit = '',
  fixed = false,
}: {
  value: number;
  better?: 'up' | 'down' | 'neutral';
  digits?: number;
  unit?: string;
  fixed?: boolean;
}) {
  const text = formatSigned(value, digits, fixed);
  if (text === '±0') return <span className="text-ink-soft">±0</span>;
  const up = value > 0;
  const good = better === 'neutral' ? null : (better === 'up') === up;
  const tone = good === null ? 'text-ink' : good ? 'text-fine-700' : 'text-fault-700';
  return (
    <span className={`font-semibold tabular-nums ${tone}`}>
      <span aria-hidden="true">{up ? '▲ ' : '▼ '}</span>
      {text}
      {unit}
    </span>
  );
}
