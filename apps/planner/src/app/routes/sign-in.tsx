import { Link, redirect, useNavigate, useSearchParams } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { paths } from '@/config/paths';
import { meQueryOptions } from '@/lib/auth';

/** Only same-site paths are followed after sign-in (no open redirect). */
export function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : paths.home.getHref();
}

/** Someone already signed in goes straight on. */
export const clientLoader = (queryClient: QueryClient) => async ({ request }: { request: Request }) => {
  // Sent here because /api/me just answered 401: no need to ask again.
  if (queryClient.getQueryState(meQueryOptions().queryKey)?.status === 'error') return null;
  try {
    await queryClient.ensureQueryData(meQueryOptions());
  } catch {
    return null;
  }
  return redirect(safeNext(new URL(request.url).searchParams.get('next')));
};

export default function SignInRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  return (
    <main className="flex min-h-screen items-center justify-center p-6">
      <div className="w-full max-w-sm rounded border border-line bg-panel p-6 shadow-sm">
        <p className="text-lg font-semibold tracking-wide text-race-800">Millrace</p>
        <h1 className="mb-4 text-2xl font-semibold">Sign in</h1>
        <SignInForm onSignedIn={() => void navigate(safeNext(params.get('next')), { replace: true })} />
        <p className="mt-4 text-sm">
          <Link className="underline" to={paths.forgotPassword.getHref()}>
            Forgot password?
          </Link>
        </p>
      </div>
    </main>
  );
}
