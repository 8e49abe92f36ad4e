import { useId, useRef, type ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';

export type TabItem = { id: string; label: string; content: () => ReactNode };

/**
 * Tabs whose choice lives in the URL (`?tab=`), so a reload or shared link opens the same tab.
 * Arrow keys move between tabs (WAI-ARIA tabs pattern).
 */
export function Tabs({ label, items }: { label: string; items: TabItem[] }) {
  const [params, setParams] = useSearchParams();
  const base = useId();
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const current = items.find((t) => t.id === params.get('tab')) ?? items[0];
  const select = (id: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set('tab', id);
        return next;
      },
      { replace: true },
    );

  return (
    <div>
      <div role="tablist" aria-label={label} className="mb-4 flex gap-1 border-b border-line">
        {items.map((tab, i) => {
          const selected = tab.id === current.id;
          return (
            <button
              key={tab.id}
              ref={(el) => {
                refs.current[i] = el;
              }}
              type="button"
              role="tab"
              id={`${base}-${tab.id}-tab`}
              aria-selected={selected}
              aria-controls={`${base}-${tab.id}-panel`}
              tabIndex={selected ? 0 : -1}
              onClick={() => select(tab.id)}
              onKeyDown={(e) => {
                const delta = e.key === 'ArrowRight' ? 1 : e.key === 'ArrowLeft' ? -1 : 0;
                if (!delta) return;
                e.preventDefault();
                const next = (i + delta + items.length) % items.length;
                select(items[next].id);
                refs.current[next]?.focus();
              }}
              className={`-mb-px border-b-4 px-3 py-2 font-semibold ${selected ? 'border-race-700 text-race-800' : 'border-transparent text-ink-soft hover:text-ink'}`}
            >
              {tab.label}
            </button>
          );
        })}
      </div>
      <div role="tabpanel" id={`${base}-${current.id}-panel`} aria-labelledby={`${base}-${current.id}-tab`}>
        {current.content()}
      </div>
    </div>
  );
}
