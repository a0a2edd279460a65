import { isRouteErrorResponse, useRouteError } from 'react-router';
import { Button, ButtonLink } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { paths } from '@/config/paths';
import { NotFoundContent } from './not-found';

/** The router's error boundary: a 404 reads as one, anything else offers a reload. */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundContent />;

  if (import.meta.env.DEV) console.error(error);

  return (
    <div role="alert" className="mx-auto flex max-w-xl flex-col items-center px-4 py-12 text-center">
      <span className="mb-4 grid size-16 place-items-center rounded-full bg-fail-soft text-fail">
        <Icon name="fail" className="size-8" />
      </span>
      <h1 className="text-2xl font-bold">This page ran into a problem</h1>
      <p className="mt-2 text-ink-muted">
        Reload to try again; if it happens again, tell your administrator what you were doing.
      </p>
      <div className="mt-6 flex flex-wrap justify-center gap-3">
        <Button variant="primary" onClick={() => window.location.reload()}>
          <Icon name="refresh" /> Reload
        </Button>
        <ButtonLink to={paths.home()} variant="secondary">
          Go to Today
        </ButtonLink>
      </div>
    </div>
  );
}
