import { Link } from 'react-router-dom';
import { isApiError } from '../lib/api-client';
import { buttonClasses } from './button';
import { Notice } from './notice';
import { PageHeader } from './page-header';

/** A record's page that could not load: "not found" for a 404, the server's words otherwise, and the way back where there is one. */
export function LoadFailure({ error, thing, notFound, back }: { error: Error; thing: string; notFound: string; back?: { to: string; label: string } }) {
  const missing = isApiError(error) && error.status === 404;
  return (
    <>
      <PageHeader title={missing ? `${thing[0].toUpperCase()}${thing.slice(1)} not found` : `The ${thing} could not be loaded`} />
      <Notice tone="error">{missing ? notFound : error.message}</Notice>
      {back ? (
        <Link to={back.to} className={`${buttonClasses('secondary')} mt-4`}>
          {back.label}
        </Link>
      ) : null}
    </>
  );
}
