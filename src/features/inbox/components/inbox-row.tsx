import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import type { InboxItem } from '@shared/schemas/inbox';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { CannotUndoPill, RequestStatusPill } from '@/components/requests/request-status';
import { formatInZone, dueWords } from '@/lib/requests/workflow-format';
import { actionLabel } from '@/lib/requests/workflow-look';
import { colors, fonts, space, touch } from '@/theme';

/** Where one tap takes you: straight to the sign-off screen for a brand lead's approval, else the request. */
export function inboxHref(item: InboxItem): Href {
  if (item.waitingFor.includes('approve')) return { pathname: '/requests/[id]/sign', params: { id: item.id } };
  return { pathname: '/requests/[id]', params: { id: item.id } };
}

/** One request that waits for me: ref and tool code, title, state, the cannot-be-undone marker, my step and its due date. */
export function InboxRow({ item, divider, timeZone, now }: { item: InboxItem; divider: boolean; timeZone: string; now: Date }) {
  const style: ViewStyle = StyleSheet.flatten([styles.row, divider && styles.divider, item.irreversible && styles.irreversibleEdge]);
  const due = dueWords(item.stageDueAt, now, timeZone);
  const ended = item.endedProductCount;
  const [first, ...rest] = item.waitingFor.map(actionLabel);
  const mine = `${first ?? ''}${rest.length ? ` (or ${rest.map((l) => l.charAt(0).toLowerCase() + l.slice(1)).join(', ')})` : ''}`;
  const id = `inbox-row-${item.ref}`;
  return (
    <Link href={inboxHref(item)} asChild>
      <Pressable style={style} role="link" testID={id} accessibilityLabel={`${item.ref} ${item.title}${due?.overdue ? `, ${due.text}` : ''}`}>
        <View style={styles.text}>
          <View style={styles.metaRow}>
            <AppText variant="monoSmall" style={styles.ref}>
              {item.ref}
            </AppText>
            <AppText variant="monoSmall" style={styles.code} testID={`${id}-tool`}>
              {item.tool.code}
            </AppText>
            <AppText variant="small" numberOfLines={1} style={styles.toolName}>
              {item.tool.name}
            </AppText>
          </View>
          <AppText variant="bodyStrong" numberOfLines={2}>
            {item.title}
          </AppText>
          <View style={styles.pills}>
            <RequestStatusPill status={item.status} testID={`${id}-status`} />
            {item.irreversible ? <CannotUndoPill testID={`${id}-irreversible`} /> : null}
            {ended > 0 ? (
              <AppText variant="small" tone="irreversible" style={styles.strong}>
                Ends {ended} {ended === 1 ? 'product' : 'products'}
              </AppText>
            ) : null}
          </View>
          <View style={styles.line}>
            <Icon name="sign" size={16} color={colors.inkSoft} />
            <AppText variant="small" style={styles.flex} testID={`${id}-mine`}>
              Yours: {mine}
            </AppText>
          </View>
          <View style={styles.line} testID={`${id}-due`}>
            <Icon name={due?.overdue ? 'alert' : 'clock'} size={16} color={due?.overdue ? colors.due : colors.inkSoft} />
            {due ? (
              <AppText variant="small" tone={due.overdue ? 'due' : 'soft'} style={due.overdue ? styles.strong : undefined}>
                {due.text}
              </AppText>
            ) : (
              <AppText variant="small">Waiting since {formatInZone(item.stageEnteredAt, timeZone)}</AppText>
            )}
          </View>
        </View>
        <Icon name="chevron-right" size={20} color={colors.steel} />
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: touch + 12,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    backgroundColor: colors.card,
  },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  irreversibleEdge: { borderLeftWidth: 4, borderLeftColor: colors.irreversible, paddingLeft: space.lg - 4 },
  text: { flex: 1, gap: space.xs },
  metaRow: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  ref: { color: colors.ink, flexShrink: 0 },
  code: { flexShrink: 0 },
  toolName: { flex: 1 },
  pills: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  strong: { fontFamily: fonts.sansMedium },
  line: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  flex: { flex: 1 },
});
