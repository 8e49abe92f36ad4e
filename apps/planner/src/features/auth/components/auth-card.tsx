import type { ReactNode } from 'react';

/** The small centred panel of the pages used without signing in (sign-in, e-mailed links). */
export function AuthCard({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center p-6">
      <div className="w-full max-w-md rounded border border-line bg-panel p-6 shadow-sm">
        <p className="text-lg font-semibold tracking-wide text-race-800">Millrace</p>
        <h1 className="mb-4 text-2xl font-semibold">{title}</h1>
        {children}
      </div>
    </main>
  );
}
