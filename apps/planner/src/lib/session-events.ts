/**
 * The session ended on the server (any call answered 401). The router listens and sends the
 * person back to the sign-in page; the query cache is cleared so no data of the old session stays.
 */
type Listener = () => void;
const listeners = new Set<Listener>();

export function onSessionLost(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function reportSessionLost(): void {
  for (const listener of listeners) listener();
}
