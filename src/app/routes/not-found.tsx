import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { PageHeader } from '../../components/page-header';

export default function NotFoundRoute() {
  return (
    <>
      <PageHeader title="Page not found" description="There is no page at this address. It may have moved, or the link was mistyped." />
      <Link to="/" className={buttonClasses('primary')}>
        Go to my home page
      </Link>
    </>
  );
}
