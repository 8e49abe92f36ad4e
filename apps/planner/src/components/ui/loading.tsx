/** A quiet, announced loading state for a page or panel. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-2 p-6 text-ink-soft">
      <span aria-hidden="true" className="inline-block h-4 w-4 animate-spin rounded-full border-2 border-race-600 border-t-transparent" />
      <span>{label}</span>
    </div>
  );
}
