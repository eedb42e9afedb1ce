import type { ReactNode } from 'react';
import { roleLabels } from '@shared/schemas/users';
import { EmptyState } from '@/components/ui/empty-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { useSession } from '@/lib/session';

/** Shows the children to administrators; everyone else sees why not. The server refuses them anyway. */
export function AdminOnly({ children }: { children: ReactNode }) {
  const { data: me } = useSession();
  if (!me) return <Loading fill />;
  if (me.role !== 'admin') {
    return (
      <Screen title="Administration" width="form" testID="admin-not-for-role">
        <EmptyState
          icon="shield"
          title="Not for your role"
          body={`Users, brands and factories are managed by administrators. You are signed in as ${roleLabels[me.role]}. If something about your account is wrong, ask your administrator.`}
          action={{ title: 'Back to Me', href: '/me', icon: 'chevron-left' }}
        />
      </Screen>
    );
  }
  return <>{children}</>;
}
