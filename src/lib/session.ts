// Session hooks used across the app (every feature needs to know who is signed in and their role).
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { sessionKeys, sessionQueries, setPassword, signIn, signOut } from '@/api/auth';

/** The signed-in user (`data`: Me), null when nobody is signed in, undefined while loading. */
export function useSession() {
  return useQuery(sessionQueries.me());
}

let signedOutOnPurpose = false;
/** True after the user pressed "Sign out": the guard then sends them to sign-in without a return path. */
export const wasSignedOutOnPurpose = () => signedOutOnPurpose;

/** Drops every cached record of the previous user, keeping only the session entry. */
function forgetOtherData(qc: QueryClient) {
  qc.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
}

async function loadFreshSession(qc: QueryClient) {
  signedOutOnPurpose = false;
  forgetOtherData(qc);
  await qc.fetchQuery({ ...sessionQueries.me(), staleTime: 0 });
}

/** After success the session query holds the user, and sign-in screens redirect on their own. */
export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: () => loadFreshSession(qc) });
}

export function useSetPassword() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: setPassword, onSuccess: () => loadFreshSession(qc) });
}

/** Clears the cookie on the server, then every cached record here; the guard shows sign-in. */
export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      signedOutOnPurpose = true;
      qc.setQueryData(sessionKeys.me(), null);
      forgetOtherData(qc);
    },
  });
}

/** Where to go after sign-in: a same-app path from `?next=`, else the inbox. */
export function safeNext(next: string | string[] | undefined): string {
  const n = Array.isArray(next) ? next[0] : next;
  if (!n || !n.startsWith('/') || n.startsWith('//') || n.startsWith('/sign-in') || n.startsWith('/set-password')) return '/inbox';
  return n;
}
