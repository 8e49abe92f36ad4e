import type { ReactNode } from 'react';

/** Shown where a list or grid has nothing in it yet, with what to do about it. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded border border-dashed border-line bg-panel p-8 text-center">
      <p className="font-semibold">{title}</p>
      {children ? <div className="mt-1 text-ink-soft">{children}</div> : null}
      {action ? <div className="mt-4 flex justify-center">{action}</div> : null}
    </div>
  );
}
