/** Says why a screen cannot be changed, so disabled inputs are not a puzzle. */
export function ReadOnlyNote({ who }: { who: string }) {
  return (
    <p role="note" className="mb-4 rounded border border-line bg-race-50 px-3 py-2 text-sm">
      <span className="font-semibold">Read only:</span> only {who} can change this.
    </p>
  );
}
