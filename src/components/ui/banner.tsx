import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { radii, space, tones } from '@/theme';
import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

/**
 * info: neutral notice. go: something went through. due: returned, due or needs your attention
 * (also form-level errors). irreversible: ONLY for "cannot be undone".
 */
export type BannerKind = 'info' | 'go' | 'due' | 'irreversible';

const defaults: Record<BannerKind, IconName> = { info: 'info', go: 'done', due: 'alert', irreversible: 'irreversible' };

export interface BannerProps {
  kind: BannerKind;
  title?: string;
  /** Plain words, or richer content (lists, buttons) as children. */
  message?: string;
  children?: ReactNode;
  icon?: IconName;
  testID?: string;
}

export function Banner({ kind, title, message, children, icon, testID }: BannerProps) {
  const t = tones[kind];
  const loud = kind === 'irreversible';
  return (
    <View
      testID={testID}
      role={kind === 'due' || loud ? 'alert' : 'status'}
      style={[styles.banner, { backgroundColor: t.bg, borderColor: t.border, borderLeftWidth: loud ? 6 : 4 }]}
    >
      <Icon name={icon ?? defaults[kind]} size={22} color={t.fg} strokeWidth={2} />
      <View style={styles.text}>
        {title ? (
          <AppText variant="bodyStrong" style={{ color: kind === 'info' ? undefined : t.fg }}>
            {title}
          </AppText>
        ) : null}
        {message ? <AppText variant="body">{message}</AppText> : null}
        {children}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  banner: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: space.md,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
  },
  text: { flex: 1, gap: space.xs },
});
