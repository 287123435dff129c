import { Link } from 'react-router-dom';
import { buttonClasses, EmptyState } from '../components/ui/index.ts';

export function NotFound() {
  return (
    <div className="p-4 sm:p-6">
      <title>Not found · Ballast</title>
      <EmptyState
        title="This page does not exist"
        action={
          <Link to="/" className={buttonClasses()}>
            Go to the start
          </Link>
        }
      >
        The address may be mistyped, or the thing it pointed at was removed.
      </EmptyState>
    </div>
  );
}
