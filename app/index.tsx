import { RootRedirect } from '@/features/auth/components/require-session';

export default function IndexRoute() {
  return <RootRedirect />;
}
