import { useRef, useState, type ReactNode } from 'react';
import { Redirect, usePathname } from 'expo-router';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { useSession, wasSignedOutOnPurpose } from '@/lib/session';

/** Auth guard for the signed-in part of the app: loading, then the children or a redirect to sign-in. */
export function RequireSession({ children }: { children: ReactNode }) {
  const session = useSession();
  const pathname = usePathname();
  // The address asked for, read on the first render: while the session loads, the router may
  // briefly report another path because the nested navigators are not mounted yet.
  const [intended] = useState(pathname);
  // When a session ends while in use (expired, deactivated), come back to the current page instead.
  const wasIn = useRef(false);
  if (session.data) wasIn.current = true;
  if (session.isPending) return <Loading fill label="Checking your session…" />;
  if (session.isError && session.data === undefined) {
    return (
      <Screen width="form">
        <ErrorState error={session.error} onRetry={() => void session.refetch()} />
      </Screen>
    );
  }
  if (!session.data) {
    const back = wasIn.current ? pathname : intended;
    const next = !wasSignedOutOnPurpose() && back && back !== '/' ? back : undefined;
    return <Redirect href={next ? { pathname: '/sign-in', params: { next } } : '/sign-in'} />;
  }
  return <>{children}</>;
}

/** `/`: the inbox when signed in, else sign-in. */
export function RootRedirect() {
  const session = useSession();
  if (session.isPending) return <Loading fill label="Opening Toolgate…" />;
  return <Redirect href={session.data ? '/inbox' : '/sign-in'} />;
}
