import type { ReducedCost } from '@millrace/contracts';

/** Products the plan leaves unmade because one more unit would lower the margin (reduced costs). */
export function NotWorthMaking({ reducedCosts }: { reducedCosts: ReducedCost[] }) {
  const notWorth = reducedCosts.filter((r) => r.outcome === 'not_worth_making');
  return (
    <section aria-labelledby="not-worth-heading" className="mt-6 flex flex-col gap-2">
      <h2 id="not-worth-heading" className="text-lg font-semibold">
        Products not worth making at the margin ({notWorth.length})
      </h2>
      {notWorth.length === 0 ? (
        <p className="text-sm text-ink-soft">Every product with demand earns its keep: none is left unmade for lack of margin.</p>
      ) : (
        <ul className="list-disc pl-5 text-sm">
          {notWorth.map((r) => (
            <li key={r.product}>{r.message}</li>
          ))}
        </ul>
      )}
    </section>
  );
}
