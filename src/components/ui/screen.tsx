import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { router, type Href } from 'expo-router';
import { colors, layout, space, touch } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { AppText } from './app-text';
import { Icon } from './icon';

export interface ScreenProps {
  title?: string;
  /** Small uppercase line above the title (e.g. "Admin", a tool code). */
  eyebrow?: string;
  subtitle?: string;
  /** Back link shown above the title; goes back in history, or to `href` after a deep link. */
  back?: { href: Href; label: string };
  /** Buttons at the right of the title (below it on phones). */
  actions?: ReactNode;
  children: ReactNode;
  /** false: the children manage their own scrolling (e.g. a FlatList). */
  scroll?: boolean;
  /** Column width: 'content' (880), 'form' (440) or 'full'. */
  width?: 'content' | 'form' | 'full';
  testID?: string;
}

/** Page frame: paper background, safe-area padding, readable max width on wide screens, title block. */
export function Screen({ title, eyebrow, subtitle, back, actions, children, scroll = true, width = 'content', testID }: ScreenProps) {
  const insets = useSafeAreaInsets();
  const wide = useWide();
  const maxWidth = width === 'form' ? layout.formMax : width === 'content' ? layout.contentMax : undefined;
  const pad = wide ? space.xxl : space.lg;
  const column = (
    <View style={[styles.column, { maxWidth, paddingHorizontal: pad, paddingTop: insets.top + (wide ? space.xxl : space.lg) }]}>
      {back ? <BackLink {...back} /> : null}
      {title ? (
        <View style={[styles.header, wide && styles.headerWide]}>
          <View style={styles.titles}>
            {eyebrow ? <AppText variant="caption">{eyebrow}</AppText> : null}
            <AppText variant={wide ? 'display' : 'title'} role="heading" aria-level={1}>
              {title}
            </AppText>
            {subtitle ? <AppText variant="small">{subtitle}</AppText> : null}
          </View>
          {actions ? <View style={styles.actions}>{actions}</View> : null}
        </View>
      ) : null}
      <View style={styles.body}>{children}</View>
    </View>
  );
  return (
    <View style={[styles.root, { paddingLeft: insets.left, paddingRight: insets.right }]} testID={testID}>
      {scroll ? (
        <ScrollView contentContainerStyle={[styles.scroll, { paddingBottom: space.xxxl }]} keyboardShouldPersistTaps="handled">
          {column}
        </ScrollView>
      ) : (
        column
      )}
    </View>
  );
}

function BackLink({ href, label }: { href: Href; label: string }) {
  return (
    <Pressable
      role="link"
      accessibilityLabel={`Back to ${label}`}
      onPress={() => (router.canGoBack() ? router.back() : router.replace(href))}
      style={({ pressed }) => [styles.back, pressed && { backgroundColor: colors.steelWash }]}
      testID="screen-back"
    >
      <Icon name="chevron-left" size={20} color={colors.inkSoft} />
      <AppText variant="label" tone="soft">
        {label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.paper },
  scroll: { flexGrow: 1 },
  column: { width: '100%', alignSelf: 'center', flexGrow: 1 },
  header: { gap: space.md, marginBottom: space.xl },
  headerWide: { flexDirection: 'row', alignItems: 'flex-end', justifyContent: 'space-between' },
  titles: { gap: space.xs, flexShrink: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  body: { gap: space.lg, flexGrow: 1 },
  back: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    minHeight: touch,
    paddingRight: space.md,
    marginLeft: -space.xs,
    marginBottom: space.xs,
    borderRadius: 6,
    gap: space.xxs,
  },
});
