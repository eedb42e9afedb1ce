import type { ReactNode } from 'react';
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import { colors, space, touch } from '@/theme';
import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

export interface ListRowProps {
  title: string;
  subtitle?: string;
  /** A code or figure, set in IBM Plex Mono (e.g. a tool code). */
  meta?: string;
  leadingIcon?: IconName;
  /** Right side: a StatusPill, a count... A chevron is added for rows that navigate. */
  trailing?: ReactNode;
  href?: Href;
  onPress?: () => void;
  /** Highlights the row whose detail is open beside the list (wide screens). */
  selected?: boolean;
  /** Draw the hairline under the row (false for the last one). */
  divider?: boolean;
  testID?: string;
}

/** One row of a list inside a Card (padded={false}). */
export function ListRow({ title, subtitle, meta, leadingIcon, trailing, href, onPress, selected, divider = true, testID }: ListRowProps) {
  const style: ViewStyle = StyleSheet.flatten([styles.row, divider && styles.divider, selected && styles.selected]);
  const content = (
    <>
      {leadingIcon ? <Icon name={leadingIcon} size={22} color={colors.inkSoft} /> : null}
      <View style={styles.text}>
        {meta ? <AppText variant="monoSmall">{meta}</AppText> : null}
        <AppText variant="bodyStrong" numberOfLines={2}>
          {title}
        </AppText>
        {subtitle ? (
          <AppText variant="small" numberOfLines={2}>
            {subtitle}
          </AppText>
        ) : null}
      </View>
      {trailing}
      {href || onPress ? <Icon name="chevron-right" size={20} color={colors.steel} /> : null}
    </>
  );
  if (href) {
    // One plain style object for <Link asChild> (see STACK.md).
    return (
      <Link href={href} asChild>
        <Pressable style={style} testID={testID} role="link">
          {content}
        </Pressable>
      </Link>
    );
  }
  if (onPress) {
    return (
      <Pressable onPress={onPress} role="button" testID={testID} style={({ pressed }) => [style, pressed && styles.pressed]}>
        {content}
      </Pressable>
    );
  }
  return (
    <View style={style} testID={testID}>
      {content}
    </View>
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
  selected: { backgroundColor: colors.steelWash, borderLeftWidth: 4, borderLeftColor: colors.ink, paddingLeft: space.lg - 4 },
  pressed: { backgroundColor: colors.steelWash },
  text: { flex: 1, gap: 2 },
});
