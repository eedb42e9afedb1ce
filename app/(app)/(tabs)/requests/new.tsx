import { RequestFormScreen } from '@/features/requests/screens/request-form-screen';

export default function NewRequestRoute() {
  return <RequestFormScreen />;
}
