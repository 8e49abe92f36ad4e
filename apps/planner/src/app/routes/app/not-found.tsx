import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/config/paths';

export default function NotFoundRoute() {
  return (
    <EmptyState
      title="There is no page at this address"
      action={
        <Link className="text-race-700 underline" to={paths.home.getHref()}>
          Go to the home page
        </Link>
      }
    >
      The link may be old, or the page may belong to another role.
    </EmptyState>
  );
}
