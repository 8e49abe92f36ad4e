import type { ReactNode } from 'react';

/**
 * A caution next to a number that could hurt someone (overtime, fatigue, machine limits). It always
 * carries the warning sign and words, never colour alone, and defers to local rules.
 */
export function Caution({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div role="note" aria-label={`Caution: ${title}`} className="rounded border border-over-700 bg-over-50 p-3 text-sm">
      <p className="font-semibold text-over-700">
        <span aria-hidden="true">⚠ </span>
        {title}
      </p>
      <div className="mt-1 text-ink">
        {children ?? 'Check against local labour law, your agreements and licensed practice before acting on this.'}
      </div>
    </div>
  );
}
