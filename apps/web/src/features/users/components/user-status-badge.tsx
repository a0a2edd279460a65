import type { User } from '@stringfield/shared';
import { Badge } from '@/components/ui/badge';

/** Active, invited (no password set yet) or deactivated, always as words. */
export function UserStatusBadge({ user }: { user: Pick<User, 'isActive' | 'hasPassword'> }) {
  if (!user.isActive)
    return (
      <Badge tone="neutral" icon="lock">
        Deactivated
      </Badge>
    );
  if (!user.hasPassword)
    return (
      <Badge tone="attention" icon="mail">
        Invited
      </Badge>
    );
  return <Badge tone="pass">Active</Badge>;
}
