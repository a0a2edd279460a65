import { Link, Outlet, useParams, useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useMailList } from '@/features/mail/api/get-mail-list';
import { useMailMessage } from '@/features/mail/api/get-mail-message';
import { MailList } from '@/features/mail/components/mail-list';
import { MailMessageView } from '@/features/mail/components/mail-message-view';
import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';

const pageSize = 20;

function pageFrom(search: URLSearchParams): number {
  const page = Number(search.get('page') ?? '1');
  return Number.isInteger(page) && page >= 1 ? page : 1;
}

/**
 * Outbox: the e-mails Stringfield has sent, as held by the local mail catcher. Two panes on a wide
 * screen; on a phone the list and the open message take turns.
 */
export function OutboxRoute() {
  const [searchParams, setSearchParams] = useSearchParams();
  const { messageId } = useParams();
  const page = pageFrom(searchParams);
  const list = useMailList({ page, pageSize });

  return (
    <>
      <PageHeader
        title="Outbox"
        description="Invitations and password-reset e-mails sent by Stringfield, held here by the local mail catcher instead of being delivered."
      />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <section aria-label="Sent messages" className={cn(messageId && 'hidden lg:block')}>
          {list.isPending ? (
            <LoadingRegion label="Loading messages" className="flex flex-col gap-2">
              {Array.from({ length: 5 }, (_, index) => (
                <Skeleton key={index} className="h-22 w-full" />
              ))}
            </LoadingRegion>
          ) : list.isError ? (
            <ErrorState title="The outbox did not load" error={list.error} onRetry={() => void list.refetch()} isRetrying={list.isFetching} />
          ) : list.data.items.length === 0 ? (
            <EmptyState
              icon="inbox"
              title="No e-mails yet"
              description="When you invite someone or a person asks to reset their password, the e-mail shows up here within a few seconds."
            />
          ) : (
            <div className={cn('flex flex-col gap-4 transition-opacity', list.isPlaceholderData && 'opacity-60')}>
              <MailList
                messages={list.data.items}
                selectedId={messageId}
                hrefFor={(message) => paths.outboxMessage(message.id, { page })}
              />
              <Pagination
                page={list.data.page}
                pageSize={list.data.pageSize}
                total={list.data.total}
                itemLabel={list.data.total === 1 ? 'message' : 'messages'}
                onPageChange={(next) => setSearchParams(next === 1 ? {} : { page: String(next) })}
              />
            </div>
          )}
        </section>
        <div className={cn(!messageId && 'hidden lg:block')}>
          <Outlet />
        </div>
      </div>
    </>
  );
}

export function OutboxIndexRoute() {
  return (
    <div className="flex h-full min-h-64 items-center justify-center rounded-card border-2 border-dashed border-edge/60 p-8 text-center text-ink-muted">
      <p className="flex items-center gap-2">
        <Icon name="mail" /> Choose a message to read it.
      </p>
    </div>
  );
}

export function OutboxMessageRoute() {
  const { messageId = '' } = useParams();
  const [searchParams] = useSearchParams();
  const message = useMailMessage(messageId);
  const back = (
    <Link
      to={paths.outbox({ page: pageFrom(searchParams) })}
      className="mb-4 inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline underline-offset-4 lg:hidden"
    >
      <Icon name="chevronLeft" /> All messages
    </Link>
  );

  if (message.isPending) {
    return (
      <>
        {back}
        <LoadingRegion label="Loading message" className="flex flex-col gap-4">
          <Skeleton className="h-36 w-full rounded-card" />
          <Skeleton className="h-96 w-full rounded-card" />
        </LoadingRegion>
      </>
    );
  }
  if (message.isError) {
    return (
      <>
        {back}
        {isApiError(message.error) && message.error.status === 404 ? (
          <Alert tone="attention" title="This message is gone">
            The mail catcher no longer holds this message. Choose another one from the list.
          </Alert>
        ) : (
          <ErrorState title="The message did not load" error={message.error} onRetry={() => void message.refetch()} isRetrying={message.isFetching} />
        )}
      </>
    );
  }
  return (
    <>
      {back}
      <MailMessageView key={message.data.id} message={message.data} />
    </>
  );
}
