import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { roleLabels, roles, type Role } from '@shared/schemas/users';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { ListRow } from '@/components/ui/list-row';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/theme';
import { UserStatus } from '../components/user-status';
import { useUsers } from '../hooks';

type RoleFilter = Role | 'all';

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

export function UserListScreen() {
  const [search, setSearch] = useState('');
  const [role, setRole] = useState<RoleFilter>('all');
  const q = useDebounced(search.trim(), 250);
  const users = useUsers({ search: q || undefined, role: role === 'all' ? undefined : role });

  return (
    <Screen
      title="Users"
      eyebrow="Admin"
      back={{ href: '/admin', label: 'Administration' }}
      actions={<Button title="Invite a user" icon="person-add" href="/admin/users/new" testID="user-new" />}
      testID="user-list"
    >
      <View style={styles.filters}>
        <TextField
          label="Search"
          placeholder="Name or e-mail"
          value={search}
          onChangeText={setSearch}
          leadingIcon="search"
          autoCapitalize="none"
          autoCorrect={false}
          testID="user-search"
        />
        <ChoiceGroup<RoleFilter>
          label="Role"
          options={[{ value: 'all', label: 'All roles' }, ...roles.map((r) => ({ value: r, label: roleLabels[r] }))]}
          value={role}
          onChange={setRole}
          testID="user-role-filter"
        />
      </View>
      {users.isPending ? (
        <Loading label="Loading users…" />
      ) : users.isError ? (
        <ErrorState error={users.error} onRetry={() => void users.refetch()} />
      ) : users.data.length === 0 ? (
        <EmptyState
          icon="people"
          title={q ? `Nobody matches “${q}”` : 'No users with this role'}
          body="Check the spelling or pick another role. To add someone, invite them: they get an e-mail with a link to choose a password."
          action={{ title: 'Invite a user', href: '/admin/users/new', icon: 'person-add' }}
        />
      ) : (
        <>
          <AppText variant="small" testID="user-count">
            {users.data.length} {users.data.length === 1 ? 'user' : 'users'}
          </AppText>
          <Card padded={false} testID="user-rows">
            {users.data.map((u, i) => (
              <ListRow
                key={u.id}
                title={u.name}
                subtitle={`${roleLabels[u.role]} · ${u.email}`}
                trailing={<UserStatus user={u} />}
                href={{ pathname: '/admin/users/[id]', params: { id: u.id } }}
                divider={i < users.data.length - 1}
                testID={`user-row-${u.email}`}
              />
            ))}
          </Card>
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.xs },
});
