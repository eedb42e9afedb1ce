import { Banner } from '@/components/ui/banner';
import { Card } from '@/components/ui/card';
import { ListRow } from '@/components/ui/list-row';
import { Screen } from '@/components/ui/screen';
import { useBrands, useFactories, useUsers } from '../hooks';

const count = (n: number | undefined, one: string, many: string) => (n === undefined ? undefined : `${n} ${n === 1 ? one : many}`);

export function AdminHomeScreen() {
  const users = useUsers();
  const brands = useBrands();
  const factories = useFactories();
  return (
    <Screen title="Administration" eyebrow="Admin" back={{ href: '/me', label: 'Me' }} testID="admin-home">
      <Card padded={false}>
        <ListRow title="Users" subtitle="Invite people, set roles, brands and factories" meta={count(users.data?.length, 'user', 'users')} leadingIcon="people" href="/admin/users" testID="admin-users-link" />
        <ListRow title="Brands" subtitle="Product lines and their codes" meta={count(brands.data?.length, 'brand', 'brands')} leadingIcon="tag" href="/admin/brands" testID="admin-brands-link" />
        <ListRow title="Factories" subtitle="Molding vendors where tools sit" meta={count(factories.data?.length, 'factory', 'factories')} leadingIcon="factory" href="/admin/factories" divider={false} testID="admin-factories-link" />
      </Card>
      <Banner
        kind="info"
        title="What administrators do here"
        message="Manage people and the organisation. An administrator sees everything but never signs on anyone's behalf: sign-offs belong to the role that makes them."
      />
    </Screen>
  );
}
