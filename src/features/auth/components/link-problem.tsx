import { Link } from 'react-router-dom';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';

/** What an expired, used, withdrawn or unknown link says, in the server's plain words, with the way on. */
export function LinkProblem({ error, title, next }: { error: unknown; title: string; next: { to: string; label: string } }) {
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="error" title={title}>
        {isApiError(error) ? error.message : 'The link could not be checked. Try again in a moment.'}
      </Notice>
      <Link to={next.to} className="font-semibold text-ink-900 underline">
        {next.label}
      </Link>
    </div>
  );
}
