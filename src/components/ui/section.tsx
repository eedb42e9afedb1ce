import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { space } from '@/theme';
import { AppText } from './app-text';

export interface SectionProps {
  title: string;
  /** A short line under the title. */
  description?: string;
  /** Buttons at the right of the title. */
  actions?: ReactNode;
  children: ReactNode;
  testID?: string;
}

/** A titled group on a screen (h2). */
export function Section({ title, description, actions, children, testID }: SectionProps) {
  return (
    <View style={styles.section} testID={testID}>
      <View style={styles.head}>
        <View style={styles.titles}>
          <AppText variant="heading" role="heading" aria-level={2}>
            {title}
          </AppText>
          {description ? <AppText variant="small">{description}</AppText> : null}
        </View>
        {actions}
      </View>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.sm },
  head: { flexDirection: 'row', alignItems: 'flex-end', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  titles: { gap: 2, flexShrink: 1 },
});
