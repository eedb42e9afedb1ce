import { UserListScreen } from '@/features/admin/screens/user-list-screen';

export default function UsersRoute() {
  return <UserListScreen />;
}
