import { Link } from 'react-router-dom';
import { buttonClasses } from '../components/Button';
import { PageHeader } from '../components/PageHeader';
import { paths } from '../lib/paths';

export function NotFoundRoute() {
  return (
    <section>
      <PageHeader title="Page not found" />
      <p className="text-graphite-700">There is no Fluxtrail screen at this address. Check the link, or start again from your home screen.</p>
      <Link to={paths.home.href()} className={buttonClasses({ variant: 'secondary' }, 'mt-6')}>
        Go to home screen
      </Link>
    </section>
  );
}
