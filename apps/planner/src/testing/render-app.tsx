import { render } from '@testing-library/react';
import { createMemoryRouter } from 'react-router-dom';
import { AppProvider } from '@/app/provider';
import { AppRouter } from '@/app/router';
import { createQueryClient } from '@/lib/react-query';

/** Renders the real app (routes, layout, loaders) at `path`, with a fresh query cache. */
export function renderApp(path: string) {
  const queryClient = createQueryClient();
  queryClient.setDefaultOptions({ queries: { ...queryClient.getDefaultOptions().queries, retry: false } });
  let router: ReturnType<typeof createMemoryRouter> | undefined;
  const view = render(
    <AppProvider queryClient={queryClient}>
      <AppRouter
        createRouter={(routes) => {
          router = createMemoryRouter(routes, { initialEntries: [path] });
          return router;
        }}
      />
    </AppProvider>,
  );
  return { ...view, queryClient, location: () => router!.state.location };
}
