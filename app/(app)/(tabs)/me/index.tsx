import { MeScreen } from '@/features/me/screens/me-screen';

export default function MeRoute() {
  return <MeScreen />;
}
