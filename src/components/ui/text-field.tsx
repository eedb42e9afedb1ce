import { forwardRef, useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, radii, space, touch } from '@/theme';
import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

export interface TextFieldProps extends Omit<TextInputProps, 'style' | 'editable'> {
  label: string;
  /** Shown under the field in a slot of fixed height (no layout jump when it appears). */
  error?: string;
  hint?: string;
  /** IBM Plex Mono for codes and figures. */
  mono?: boolean;
  leadingIcon?: IconName;
  /** Password fields: adds a show/hide button. */
  revealable?: boolean;
  disabled?: boolean;
  /** Rendered at the right end of the label row (e.g. a "Forgot?" link). */
  labelAccessory?: ReactNode;
  /** testID of the input; the error text gets `${testID}-error`. */
  testID?: string;
}

export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, error, hint, mono, leadingIcon, revealable, disabled, labelAccessory, testID, secureTextEntry, onFocus, onBlur, ...input },
  ref,
) {
  const [focused, setFocused] = useState(false);
  const [revealed, setRevealed] = useState(false);
  const borderColor = error ? colors.due : focused ? colors.focus : colors.steel;
  return (
    <View style={styles.field}>
      <View style={styles.labelRow}>
        <AppText variant="label">{label}</AppText>
        {labelAccessory}
      </View>
      <View style={[styles.box, { borderColor, borderWidth: focused || error ? 2 : 1 }, disabled && styles.disabled]}>
        {leadingIcon ? <Icon name={leadingIcon} size={20} color={colors.inkFaint} style={styles.leading} /> : null}
        <TextInput
          ref={ref}
          {...input}
          editable={!disabled}
          secureTextEntry={secureTextEntry && !revealed}
          accessibilityLabel={label}
          aria-invalid={error ? true : undefined}
          placeholderTextColor={colors.inkFaint}
          testID={testID}
          onFocus={(e) => {
            setFocused(true);
            onFocus?.(e);
          }}
          onBlur={(e) => {
            setFocused(false);
            onBlur?.(e);
          }}
          style={[styles.input, mono && styles.mono, input.multiline && styles.multiline]}
        />
        {revealable && secureTextEntry ? (
          <Pressable
            onPress={() => setRevealed((v) => !v)}
            role="button"
            accessibilityLabel={revealed ? 'Hide password' : 'Show password'}
            style={styles.reveal}
            testID={testID ? `${testID}-reveal` : undefined}
          >
            <Icon name={revealed ? 'eye-off' : 'eye'} size={20} color={colors.inkSoft} />
          </Pressable>
        ) : null}
      </View>
      <View style={styles.slot}>
        {error ? (
          <View style={styles.errorRow} role="alert">
            <Icon name="alert" size={16} color={colors.due} />
            <AppText variant="small" tone="due" style={styles.errorText} testID={testID ? `${testID}-error` : undefined}>
              {error}
            </AppText>
          </View>
        ) : hint ? (
          <AppText variant="small" tone="faint">
            {hint}
          </AppText>
        ) : null}
      </View>
    </View>
  );
});

const styles = StyleSheet.create({
  field: { alignSelf: 'stretch' },
  labelRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end', marginBottom: space.xs },
  box: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: touch + 4,
    backgroundColor: colors.card,
    borderRadius: radii.md,
  },
  disabled: { backgroundColor: colors.steelWash },
  leading: { marginLeft: space.md },
  input: {
    flex: 1,
    minHeight: touch,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    fontFamily: fonts.sans,
    fontSize: 16,
    color: colors.ink,
    outlineStyle: 'none',
  } as object,
  mono: { fontFamily: fonts.mono },
  multiline: { minHeight: 96, textAlignVertical: 'top' },
  reveal: { width: touch, height: touch, alignItems: 'center', justifyContent: 'center' },
  // Reserved so an error appearing on blur does not move the button under the pointer.
  slot: { minHeight: 24, paddingTop: space.xs },
  errorRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs },
  errorText: { flex: 1, fontFamily: fonts.sansMedium },
});
