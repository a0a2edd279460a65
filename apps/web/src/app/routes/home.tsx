import type { SessionUser } from '@stringfield/shared';
import { ButtonLink } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { MyWork } from '@/features/home/components/my-work';
import { Overview } from '@/features/home/components/overview';
import { getMyWorkOrders, myWorkOrdersQueryOptions } from '@/features/work-orders/api/get-my-work-orders';
import { MyWorkList } from '@/features/work-orders/components/my-work-list';
import { startEarly } from '@/lib/early-answers';
import { navItemsFor } from '../nav';
import { useSessionUser } from '../session';

/** A technician's work list, asked for as the page's code arrives (the other roles' overview asks for nothing). */
export function startFirstAnswers(user: SessionUser) {
  if (user.role === 'technician') startEarly(myWorkOrdersQueryOptions().queryKey, () => getMyWorkOrders());
}

/** "Today": technicians get their phone-first work list; every other role an overview. */
export function HomeRoute() {
  const user = useSessionUser();
  if (user.role === 'technician') return <MyWork user={user} work={<MyWorkList />} />;

  // Shortcuts are the role's own navigation, minus Today itself.
  const shortcuts = navItemsFor(user.role).filter((item) => !item.isExact);
  return (
    <Overview
      user={user}
      actions={
        shortcuts.length > 0 ? (
          <div className="flex flex-wrap justify-center gap-3">
            {shortcuts.map((item, index) => (
              <ButtonLink key={item.to} to={item.to} variant={index === 0 ? 'primary' : 'secondary'}>
                <Icon name={item.icon} /> {item.label}
              </ButtonLink>
            ))}
          </div>
        ) : undefined
      }
    />
  );
}
