import { Pressable, StyleSheet, View } from 'react-native';
import { colors, fonts, radii, space, touch } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { AppText } from './app-text';
import { Icon } from './icon';

export interface Choice<T extends string> {
  value: T;
  label: string;
  /** Short second line in words (e.g. a factory's city). */
  hint?: string;
  /** Short second line set in IBM Plex Mono (e.g. a brand code). */
  code?: string;
}

interface Common<T extends string> {
  label: string;
  options: readonly Choice<T>[];
  error?: string;
  hint?: string;
  disabled?: boolean;
  /** Each option gets `${testID}-${value}`; the error text `${testID}-error`. */
  testID?: string;
}
export type ChoiceGroupProps<T extends string> = Common<T> &
  ({ multiple?: false; value: T | null; onChange: (v: T) => void } | { multiple: true; value: readonly T[]; onChange: (v: T[]) => void });

/** Pick one (radio) or several (checkbox) from a short list, as large tappable chips with a tick. */
export function ChoiceGroup<T extends string>(props: ChoiceGroupProps<T>) {
  const { label, options, error, hint, disabled, testID } = props;
  const wide = useWide();
  // Two-line options read better one per row on a phone.
  const stack = !wide && options.some((o) => o.hint || o.code);
  const isOn = (v: T) => (props.multiple ? props.value.includes(v) : props.value === v);
  const toggle = (v: T) => {
    if (props.multiple) props.onChange(props.value.includes(v) ? props.value.filter((x) => x !== v) : [...props.value, v]);
    else props.onChange(v);
  };
  return (
    <View style={styles.group} role={props.multiple ? 'group' : 'radiogroup'} accessibilityLabel={label}>
      <AppText variant="label">{label}</AppText>
      <View style={styles.options}>
        {options.map((o) => {
          const on = isOn(o.value);
          return (
            <Pressable
              key={o.value}
              role={props.multiple ? 'checkbox' : 'radio'}
              aria-checked={on}
              accessibilityLabel={[o.label, o.hint, o.code].filter(Boolean).join(', ')}
              disabled={disabled}
              onPress={() => toggle(o.value)}
              testID={testID ? `${testID}-${o.value}` : undefined}
              style={({ pressed }) => [styles.chip, stack && styles.stacked, on && styles.chipOn, pressed && styles.pressed, disabled && styles.disabled]}
            >
              <View style={[props.multiple ? styles.box : styles.radio, on && styles.markOn]}>
                {on ? <Icon name="check" size={14} color={colors.onColour} strokeWidth={3} /> : null}
              </View>
              <View style={styles.optionText}>
                <AppText variant="label" style={on ? styles.labelOn : undefined}>
                  {o.label}
                </AppText>
                {o.hint ? <AppText variant="small">{o.hint}</AppText> : null}
                {o.code ? <AppText variant="monoSmall">{o.code}</AppText> : null}
              </View>
            </Pressable>
          );
        })}
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
}

const styles = StyleSheet.create({
  group: { gap: space.xs, alignSelf: 'stretch' },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    // A long hint wraps inside the chip instead of pushing it past the edge.
    maxWidth: '100%',
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    minHeight: touch,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steel,
    backgroundColor: colors.card,
  },
  stacked: { alignSelf: 'stretch', width: '100%' },
  optionText: { flexShrink: 1 },
  chipOn: { borderColor: colors.ink, borderWidth: 2, paddingHorizontal: space.md - 1 },
  pressed: { backgroundColor: colors.steelWash },
  disabled: { opacity: 0.55 },
  box: { width: 20, height: 20, borderRadius: 4, borderWidth: 1.5, borderColor: colors.steel, alignItems: 'center', justifyContent: 'center' },
  radio: { width: 20, height: 20, borderRadius: 10, borderWidth: 1.5, borderColor: colors.steel, alignItems: 'center', justifyContent: 'center' },
  markOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  labelOn: { fontFamily: fonts.sansSemiBold },
  slot: { minHeight: 24, paddingTop: space.xs },
  errorRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs },
  errorText: { flex: 1, fontFamily: fonts.sansMedium },
});
