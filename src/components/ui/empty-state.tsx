import type { Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { colors, space } from '@/theme';
import { AppText } from './app-text';
import { Button } from './button';
import { Icon, type IconName } from './icon';

export interface EmptyStateProps {
  icon: IconName;
  /** What is empty, in words ("No change requests yet"). */
  title: string;
  /** When things appear here and what to do meanwhile. */
  body: string;
  action?: { title: string; href?: Href; onPress?: () => void; icon?: IconName };
  testID?: string;
}

export function EmptyState({ icon, title, body, action, testID }: EmptyStateProps) {
  return (
    <View style={styles.wrap} testID={testID}>
      <View style={styles.badge}>
        <Icon name={icon} size={32} color={colors.inkSoft} strokeWidth={1.6} />
      </View>
      <AppText variant="heading" align="center">
        {title}
      </AppText>
      <AppText variant="body" tone="soft" align="center" style={styles.body}>
        {body}
      </AppText>
      {action ? (
        <View style={styles.action}>
          <Button title={action.title} href={action.href} onPress={action.onPress} icon={action.icon} variant="secondary" />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: {
    alignItems: 'center',
    paddingVertical: space.xxxl,
    paddingHorizontal: space.xl,
    gap: space.sm,
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.steel,
    borderRadius: 10,
  },
  badge: {
    width: 64,
    height: 64,
    borderRadius: 32,
    backgroundColor: colors.steelWash,
    alignItems: 'center',
    justifyContent: 'center',
    marginBottom: space.sm,
  },
  body: { maxWidth: 440 },
  action: { marginTop: space.md },
});
