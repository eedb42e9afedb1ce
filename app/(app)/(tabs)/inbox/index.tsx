import { InboxScreen } from '@/features/inbox/screens/inbox-screen';

export default function InboxRoute() {
  return <InboxScreen />;
}
