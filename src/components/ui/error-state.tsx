import { StyleSheet, View } from 'react-native';
import { isApiError, toUserMessage } from '@/api/errors';
import { colors, space } from '@/theme';
import { AppText } from './app-text';
import { Button } from './button';
import { Icon, type IconName } from './icon';

export interface ErrorStateProps {
  error: unknown;
  /** Shown as a "Try again" button. Leave out when retrying cannot help. */
  onRetry?: () => void;
  /** Overrides the heading picked from the error kind. */
  title?: string;
  testID?: string;
}

function describe(error: unknown): { icon: IconName; title: string } {
  if (!isApiError(error)) return { icon: 'alert', title: 'This did not load' };
  if (error.code === 'network') return { icon: 'offline', title: 'No connection' };
  if (error.status === 403) return { icon: 'shield', title: 'Not for your role' };
  if (error.status === 404) return { icon: 'search', title: 'Not found' };
  return { icon: 'alert', title: 'This did not load' };
}

/** A failed load: what happened in words, and a way forward. */
export function ErrorState({ error, onRetry, title, testID = 'error-state' }: ErrorStateProps) {
  const d = describe(error);
  return (
    <View style={styles.wrap} testID={testID} role="alert">
      <Icon name={d.icon} size={28} color={colors.due} strokeWidth={1.8} />
      <AppText variant="heading" align="center">
        {title ?? d.title}
      </AppText>
      <AppText variant="body" tone="soft" align="center" style={styles.message}>
        {toUserMessage(error)}
      </AppText>
      {onRetry ? <Button title="Try again" icon="refresh" variant="secondary" onPress={onRetry} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { alignItems: 'center', gap: space.sm, paddingVertical: space.xxl, paddingHorizontal: space.lg },
  message: { maxWidth: 440, marginBottom: space.sm },
});
