import { ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { paths } from '@/config/paths';

export function NotFoundContent() {
  return (
    <div className="mx-auto max-w-2xl pt-4">
      <h1 className="sr-only">Page not found</h1>
      <EmptyState
        icon="compass"
        title="There is no page at this address"
        description="The link may be mistyped, or the page may have moved. Check the address, or start again from Today."
        action={
          <ButtonLink to={paths.home()} variant="brand">
            Go to Today
          </ButtonLink>
        }
      />
    </div>
  );
}

export function NotFoundRoute() {
  return <NotFoundContent />;
}
