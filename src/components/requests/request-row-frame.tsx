import type { ReactNode } from 'react';
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import type { RequestSummary } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { CannotUndoPill, RequestStatusPill } from '@/components/requests/request-status';
import { colors, fonts, space, touch } from '@/theme';

/**
 * The part every request row shares (list, inbox): ref and tool code in mono, the title, the state in
 * words, the cannot-be-undone marker and how many products it ends. Extra lines come as children.
 * Test IDs: `${testID}`, `-tool`, `-status`, `-irreversible`.
 */
export function RequestRowFrame(props: {
  r: RequestSummary;
  href: Href;
  divider: boolean;
  testID: string;
  accessibilityLabel: string;
  children?: ReactNode;
}) {
  const { r, testID } = props;
  const style: ViewStyle = StyleSheet.flatten([styles.row, props.divider && styles.divider, r.irreversible && styles.irreversibleEdge]);
  const ended = r.endedProductCount;
  return (
    <Link href={props.href} asChild>
      <Pressable style={style} role="link" testID={testID} accessibilityLabel={props.accessibilityLabel}>
        <View style={styles.text}>
          <View style={styles.metaRow}>
            <AppText variant="monoSmall" style={styles.ref}>
              {r.ref}
            </AppText>
            <AppText variant="monoSmall" style={styles.code} testID={`${testID}-tool`}>
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
            <RequestStatusPill status={r.status} testID={`${testID}-status`} />
            {r.irreversible ? <CannotUndoPill testID={`${testID}-irreversible`} /> : null}
            {ended > 0 ? (
              <AppText variant="small" tone="irreversible" style={styles.strong}>
                Ends {ended} {ended === 1 ? 'product' : 'products'}
              </AppText>
            ) : null}
          </View>
          {props.children}
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
});
