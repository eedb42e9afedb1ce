import { Link } from 'expo-router';
import { Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import type { RequestSummary } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, fonts, space, touch } from '@/theme';
import { formatDay } from '@/lib/requests/format';
import { CannotUndoPill, RequestStatusPill } from '@/components/requests/request-status';

/** One request in the list: ref and tool code (mono), title, state in words, and the cannot-be-undone marker. */
export function RequestRow({ r, divider }: { r: RequestSummary; divider: boolean }) {
  const style: ViewStyle = StyleSheet.flatten([styles.row, divider && styles.divider, r.irreversible && styles.irreversibleEdge]);
  const ended = r.endedProductCount;
  return (
    <Link href={{ pathname: '/requests/[id]', params: { id: r.id } }} asChild>
      <Pressable style={style} role="link" testID={`request-row-${r.ref}`} accessibilityLabel={`${r.ref} ${r.title}`}>
        <View style={styles.text}>
          <View style={styles.metaRow}>
            <AppText variant="monoSmall" style={styles.ref}>
              {r.ref}
            </AppText>
            <AppText variant="monoSmall" style={styles.code}>
              {r.tool.code}
            </AppText>
            <AppText variant="small" numberOfLines={1} style={styles.toolName}>
              {r.tool.name}
            </AppText>
          </View>
          <AppText variant="bodyStrong" numberOfLines={2}>
            {r.title}
          </AppText>
          <View style={styles.pills}>
            <RequestStatusPill status={r.status} testID={`request-row-${r.ref}-status`} />
            {r.irreversible ? <CannotUndoPill testID={`request-row-${r.ref}-irreversible`} /> : null}
            {ended > 0 ? (
              <AppText variant="small" tone="irreversible" style={styles.ends}>
                Ends {ended} {ended === 1 ? 'product' : 'products'}
              </AppText>
            ) : null}
          </View>
          <AppText variant="small" tone="faint">
            {r.brand.name} · {r.submitter.name} · {formatDay(r.updatedAt)}
          </AppText>
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
  ends: { fontFamily: fonts.sansMedium },
});
