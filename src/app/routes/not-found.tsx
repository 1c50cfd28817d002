import { Link } from 'react-router-dom';
import { EmptyState } from '@/components/ui/states';
import { paths } from '@/config/paths';

export default function NotFoundRoute() {
  return (
    <EmptyState title="There is no page at this address.">
      <Link className="text-lagoon-700 underline" to={paths.home.href()}>
        Go to the start page
      </Link>
    </EmptyState>
  );
}
