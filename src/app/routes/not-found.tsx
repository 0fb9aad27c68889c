import { Link } from 'react-router-dom';
import { paths } from '../../lib/paths';

export default function NotFoundPage() {
  return (
    <div className="mx-auto max-w-lg p-10">
      <h1>Not found</h1>
      <p className="mt-2 text-ink-soft">There is no page at this address.</p>
      <Link to={paths.home()} className="mt-6 inline-block text-accent underline">Back to productions</Link>
    </div>
  );
}
