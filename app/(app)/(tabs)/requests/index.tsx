import { RequestListScreen } from '@/features/requests/screens/request-list-screen';

export default function RequestsRoute() {
  return <RequestListScreen />;
}
