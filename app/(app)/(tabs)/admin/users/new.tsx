import { UserCreateScreen } from '@/features/admin/screens/user-create-screen';

export default function NewUserRoute() {
  return <UserCreateScreen />;
}
