import type { Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import type { InboxItem } from '@shared/schemas/inbox';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { RequestRowFrame } from '@/components/requests/request-row-frame';
import { formatInZone, dueWords } from '@/lib/requests/workflow-format';
import { actionLabel } from '@/lib/requests/workflow-look';
import { colors, fonts, space } from '@/theme';

/** Where one tap takes you: straight to the sign-off screen for a brand lead's approval, else the request. */
export function inboxHref(item: InboxItem): Href {
  if (item.waitingFor.includes('approve')) return { pathname: '/requests/[id]/sign', params: { id: item.id } };
  return { pathname: '/requests/[id]', params: { id: item.id } };
}

/** One request that waits for me: the shared row plus my step and its due date. */
export function InboxRow({ item, divider, timeZone, now }: { item: InboxItem; divider: boolean; timeZone: string; now: Date }) {
  const due = dueWords(item.stageDueAt, now, timeZone);
  const [first, ...rest] = item.waitingFor.map(actionLabel);
  const mine = `${first ?? ''}${rest.length ? ` (or ${rest.map((l) => l.charAt(0).toLowerCase() + l.slice(1)).join(', ')})` : ''}`;
  const id = `inbox-row-${item.ref}`;
  return (
    <RequestRowFrame
      r={item}
      href={inboxHref(item)}
      divider={divider}
      testID={id}
      accessibilityLabel={`${item.ref} ${item.title}${due?.overdue ? `, ${due.text}` : ''}`}
    >
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
    </RequestRowFrame>
  );
}

const styles = StyleSheet.create({
  strong: { fontFamily: fonts.sansMedium },
  line: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  flex: { flex: 1 },
});
