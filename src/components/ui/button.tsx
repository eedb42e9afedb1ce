import { Link, type Href } from 'expo-router';
import { ActivityIndicator, Pressable, StyleSheet, Text, View, type ViewStyle } from 'react-native';
import { colors, fonts, radii, space, touch } from '@/theme';
import { Icon, type IconName } from './icon';

/**
 * primary: the one "go" action on a screen (teal). secondary: other actions. quiet: low-weight
 * text action. irreversible: ONLY for an action that cannot be undone (molten orange-red).
 */
export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'irreversible';

export interface ButtonProps {
  title: string;
  onPress?: () => void;
  /** Navigate instead of act: rendered as a link (anchor on the web). */
  href?: Href;
  variant?: ButtonVariant;
  icon?: IconName;
  iconRight?: IconName;
  disabled?: boolean;
  /** Shows a spinner and blocks presses; `busyTitle` replaces the title meanwhile. */
  busy?: boolean;
  busyTitle?: string;
  /** Stretch to the container's width (forms on phones). */
  block?: boolean;
  testID?: string;
  accessibilityLabel?: string;
}

const look: Record<ButtonVariant, { bg: string; fg: string; border: string; pressed: string }> = {
  primary: { bg: colors.go, fg: colors.onColour, border: colors.go, pressed: '#0B5F58' },
  secondary: { bg: colors.card, fg: colors.ink, border: colors.steel, pressed: colors.steelWash },
  quiet: { bg: 'transparent', fg: colors.ink, border: 'transparent', pressed: colors.steelWash },
  irreversible: { bg: colors.irreversible, fg: colors.onColour, border: colors.irreversible, pressed: '#A3370A' },
};

export function Button({
  title,
  onPress,
  href,
  variant = 'primary',
  icon,
  iconRight,
  disabled,
  busy,
  busyTitle,
  block,
  testID,
  accessibilityLabel,
}: ButtonProps) {
  const l = look[variant];
  const inactive = disabled || busy;
  const base: ViewStyle = {
    ...styles.base,
    backgroundColor: l.bg,
    borderColor: l.border,
    opacity: inactive ? 0.55 : 1,
    alignSelf: block ? 'stretch' : 'flex-start',
    paddingHorizontal: variant === 'quiet' ? space.sm : space.lg,
  };
  const content = (
    <View style={styles.row}>
      {busy ? <ActivityIndicator size="small" color={l.fg} /> : icon ? <Icon name={icon} size={18} color={l.fg} /> : null}
      <Text style={[styles.label, { color: l.fg }, variant === 'quiet' && styles.quietLabel]} numberOfLines={1}>
        {busy && busyTitle ? busyTitle : title}
      </Text>
      {iconRight && !busy ? <Icon name={iconRight} size={18} color={l.fg} /> : null}
    </View>
  );

  if (href && !inactive) {
    // <Link asChild> merges styles by object spread: give the child ONE plain style object.
    return (
      <Link href={href} asChild>
        <Pressable style={StyleSheet.flatten(base)} testID={testID} accessibilityLabel={accessibilityLabel} role="link">
          {content}
        </Pressable>
      </Link>
    );
  }
  return (
    <Pressable
      onPress={onPress}
      disabled={inactive}
      role="button"
      accessibilityState={{ disabled: !!inactive, busy: !!busy }}
      accessibilityLabel={accessibilityLabel}
      testID={testID}
      style={({ pressed }) => [base, pressed && { backgroundColor: l.pressed }]}
    >
      {content}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: touch,
    minWidth: touch,
    borderRadius: radii.md,
    borderWidth: 1,
    justifyContent: 'center',
    paddingVertical: space.sm,
  },
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'center', gap: space.sm },
  label: { fontFamily: fonts.sansSemiBold, fontSize: 16, lineHeight: 22 },
  quietLabel: { textDecorationLine: 'underline' },
});
